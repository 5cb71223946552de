import crypto from 'node:crypto';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { solventDiffusionLimit } from '@shared/engine';
import { MECHANISM_VERDICT_WORDS, type MechanismVerdictValue } from '@shared/schemas/mechanism-evidence';
import { pointAt } from '@shared/schemas/study-points';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { signedInResearcher, type ApiClient } from '../support/accounts';
import { createStudyRecord } from '../support/study-records';
import { createStudy } from '../support/studies';
import { keptLogLines, linesWhen } from '../support/log-lines';
import { createTestApp } from '../support/test-app';

// At debug level each request's log line counts its database round trips (as in read-round-trips.test.ts).
const sequelize = createSequelize(inject('databaseUrl'), { timeQueries: true });
initModels(sequelize);
const { lines, logger } = keptLogLines<Line>('debug');
const testApp = await createTestApp({ sequelize, logger });
let client: ApiClient, csrf: string, labId: string, emitterId: string;
beforeAll(async () => {
  ({ client, csrf, labId } = await signedInResearcher(testApp));
});
afterAll(async () => {
  await testApp.close();
  await sequelize.close();
});

type Line = { req?: { url: string }; res?: { statusCode: number }; database?: { queries: number } };

async function roundTripsOf(url: string): Promise<{ queries: number; body: Comparison }> {
  lines.length = 0;
  const response = await client.get(url);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  const [line] = await linesWhen(lines, (entry) => entry.req?.url === url && entry.res?.statusCode === 200);
  expect(line, `no log line for ${url}`).toBeDefined();
  return { queries: line!.database?.queries ?? 0, body: response.body as Comparison };
}

type Comparison = { rows: { studyId: string; title: string; mechanism: string }[] };

/*
 * Titrations invented for the test, K_SV = 500 M⁻¹ and tau0 = 1 µs, with a fixed ±1 % wobble so
 * the fits have an uncertainty. Dynamic: tau0/tau = I0/I point by point. Static: the intensity
 * falls, the lifetime stays. Without lifetimes only the intensities are given (Lakowicz,
 * Principles of Fluorescence Spectroscopy, 3rd ed., ch. 8, from memory).
 */
const concentrations = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3, 6e-3];
const wobble = [0, 0.01, -0.008, 0.006, -0.01, 0.004, -0.005];
const titration = (lifetimes: 'dynamic' | 'static' | 'none') =>
  concentrations.map((q, i) => ({
    ...pointAt(q),
    intensity: (1000 / (1 + 500 * q)) * (1 + wobble[i]!),
    lifetime:
      lifetimes === 'none'
        ? null
        : lifetimes === 'dynamic'
          ? 1e-6 / (1 + 500 * q) / (1 + wobble[i]!)
          : 1e-6 * (1 - wobble[(i + 3) % 7]!),
  }));

/** A fitted study of the test's one emitter with a new quencher (the first one names the emitter). */
async function fittedStudy(title: string, lifetimes: 'dynamic' | 'static' | 'none') {
  const tag = crypto.randomBytes(3).toString('hex');
  const study = await createStudy(client, labId, tag, {
    title,
    fitModel: 'linear-fixed',
    ...(emitterId ? { emitterId, newEmitterName: undefined } : {}),
  });
  emitterId = study.emitter.id;
  const patched = await client.patch(`/api/labs/${labId}/studies/${study.id}/points`, {
    version: study.version,
    points: titration(lifetimes),
  });
  expect(patched.status, JSON.stringify(patched.body)).toBe(200);
  return study;
}

/** Two invented Gaussian emission bands quenched at 300 and 30 M⁻¹: K_SV changes across the emission. */
async function twoEmitterMatrix(studyId: string) {
  const wavelengths = Array.from({ length: 121 }, (_, i) => 400 + i);
  const mM = [0, 2, 4, 6, 8];
  const g = (nm: number, centre: number) => 1000 * Math.exp(-(((nm - centre) / 15) ** 2) / 2);
  const rows = wavelengths.map((nm, k) => [
    nm,
    ...mM.map((c, j) =>
      (g(nm, 430) / (1 + 0.3 * c) + g(nm, 500) / (1 + 0.03 * c) + ((k * 7 + j * 3) % 5) - 2).toFixed(2),
    ),
  ]);
  const file = [['nm', ...mM.map((c) => `${c} mM`)], ...rows].map((row) => row.join(',')).join('\n');
  const kept = await client.agent
    .post(`/api/labs/${labId}/studies/${studyId}/spectrum-matrices`)
    .set('x-csrf-token', csrf)
    .attach('file', Buffer.from(`${file}\n`), 'spectra.csv');
  expect(kept.status, JSON.stringify(kept.body)).toBe(201);
}

const comparisonUrl = () => `/api/labs/${labId}/comparisons/emitter/${emitterId}`;
const verdictOf = (body: Comparison, title: string) => body.rows.find((row) => row.title === title)?.mechanism;

describe('GET /api/labs/:labId/comparisons/:side/:compoundId (mechanism column)', () => {
  it('when studies carry different evidence, then each row has its verdict in the same statements however many rows there are', async () => {
    await fittedStudy('dynamic by lifetimes', 'dynamic');
    await fittedStudy('static by lifetimes', 'static');
    const before = await roundTripsOf(comparisonUrl());
    expect(verdictOf(before.body, 'dynamic by lifetimes')).toBe('dynamic');
    expect(verdictOf(before.body, 'static by lifetimes')).toBe('static');

    const twoBands = await fittedStudy('two emitting bands', 'dynamic');
    await twoEmitterMatrix(twoBands.id);
    await fittedStudy('intensities only', 'none');
    const warmed = await fittedStudy('warmed series', 'none');
    // K_SV following T/eta(T) of acetonitrile, as diffusion-controlled quenching does (Smoluchowski–Stokes–Einstein).
    const at = (t: number) =>
      (500 * solventDiffusionLimit('acetonitrile', t)) / solventDiffusionLimit('acetonitrile', 298.15);
    for (const temperature of [283.15, 313.15, 328.15])
      await createStudyRecord({
        labId,
        emitterId,
        quencherId: warmed.quencher.id,
        title: `warmed series at ${temperature} K`,
        kSv: at(temperature),
        kq: at(temperature) / 1e-6,
        temperature,
      });

    const after = await roundTripsOf(comparisonUrl());
    expect(after.body.rows).toHaveLength(2 + 3 + 3);
    expect(before.queries).toBeGreaterThan(0);
    expect(after.queries).toBe(before.queries);
    expect(verdictOf(after.body, 'two emitting bands')).toBe('two-emitters');
    expect(verdictOf(after.body, 'intensities only')).toBe('unclear');
    // No lifetimes, but the series' K_SV rises with T/eta: the temperature trend leans dynamic.
    expect(verdictOf(after.body, 'warmed series')).toBe('dynamic');
    expect(verdictOf(after.body, 'warmed series at 328.15 K')).toBe('dynamic');
  });

  it("when a row's verdict is read, then it is the verdict of that study's own mechanism evidence", async () => {
    const { body } = await roundTripsOf(comparisonUrl());
    expect(body.rows.length).toBeGreaterThanOrEqual(8);
    for (const row of body.rows) {
      const single = await client.get(`/api/labs/${labId}/studies/${row.studyId}/mechanism`);
      expect(single.status).toBe(200);
      expect(row.mechanism, row.title).toBe(single.body.verdict);
    }
  });

  it('when exported, then the CSV has the verdict of each row in a mechanism column', async () => {
    const { body } = await roundTripsOf(comparisonUrl());
    const response = await client.get(`${comparisonUrl()}/export.csv`);
    expect(response.status).toBe(200);
    const [, , header, ...rows] = response.text.trim().split('\n');
    expect(header!.split(',').at(-1)).toBe('mechanism');
    // The CSV keeps the table's order (kq, highest first).
    expect(rows.map((row) => row.split(',').at(-1))).toEqual(body.rows.map((row) => row.mechanism));
  });

  it('when the comparison is reported, then the PDF table has a mechanism column with the words for each verdict', async () => {
    const { body } = await roundTripsOf(comparisonUrl());
    const pdf = await client.agent
      .get(`${comparisonUrl()}/report.pdf`)
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    // Words wrapped at a hyphen in a narrow column are joined again.
    const text = (await parser.getText()).text.replace(/\s+/g, ' ').replace(/- /g, '-');
    await parser.destroy();
    expect(text).toContain('Mechanism');
    for (const verdict of new Set(body.rows.map((row) => row.mechanism as MechanismVerdictValue)))
      expect(text).toContain(MECHANISM_VERDICT_WORDS[verdict]);
  });
});
