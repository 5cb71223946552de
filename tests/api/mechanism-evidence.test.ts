import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { solventDiffusionLimit } from '@shared/engine';
import { pointAt } from '@shared/schemas/study-points';
import { apiClient, createLabWithMembers, signedInResearcher, type ApiClient } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
let client: ApiClient, csrf: string, labId: string;
beforeAll(async () => {
  ({ client, csrf, labId } = await signedInResearcher(testApp));
});
afterAll(testApp.close);

/*
 * Titrations invented for the test, K_SV = 500 M⁻¹ and tau0 = 1 µs, with a fixed ±1 % wobble so
 * the fits have an uncertainty. Dynamic: tau0/tau = I0/I point by point. Static: the intensity falls, the
 * lifetime stays (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., ch. 8, from memory).
 */
const concentrations = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3, 6e-3];
const wobble = [0, 0.01, -0.008, 0.006, -0.01, 0.004, -0.005];
const titration = (lifetimeQuenched: boolean) =>
  concentrations.map((q, i) => ({
    ...pointAt(q),
    intensity: (1000 / (1 + 500 * q)) * (1 + wobble[i]!),
    lifetime: lifetimeQuenched ? 1e-6 / (1 + 500 * q) / (1 + wobble[i]!) : 1e-6 * (1 - wobble[(i + 3) % 7]!),
  }));

async function fittedStudy(lifetimeQuenched: boolean, extra: Record<string, unknown> = {}) {
  const study = await createStudy(client, labId, crypto.randomBytes(3).toString('hex'), {
    fitModel: 'linear-fixed',
    ...extra,
  });
  const patched = await client.patch(`/api/labs/${labId}/studies/${study.id}/points`, {
    version: study.version,
    points: titration(lifetimeQuenched),
  });
  expect(patched.status, JSON.stringify(patched.body)).toBe(200);
  return study;
}

const evidence = (studyId: string) => client.get(`/api/labs/${labId}/studies/${studyId}/mechanism`);

describe('GET /api/labs/:labId/studies/:studyId/mechanism', () => {
  it('when lifetimes fall as intensities do, then dynamic, kq is read against k_diff and the rest is named missing', async () => {
    const study = await fittedStudy(true);
    const response = await evidence(study.id);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.verdict).toBe('dynamic');
    const kinds = response.body.pieces.map((piece: { kind: string; reading: string }) => [piece.kind, piece.reading]);
    // kq = 500 M⁻¹ / 1 µs = 5e8 M⁻¹ s⁻¹, far below k_diff of acetonitrile (about 1.9e10 at 25 °C; common practice)
    expect(kinds).toEqual([
      ['lifetime', 'dynamic'],
      ['diffusion', 'neutral'],
    ]);
    expect(response.body.missing.map((piece: { kind: string }) => piece.kind)).toEqual([
      'temperature',
      'wavelength',
      'absorption',
    ]);
    expect(response.body.missing[0].reason).toMatch(/1 temperature/);
    expect(response.body.series).toBeNull();
  });

  it('when the lifetime stays while the intensity falls, then static', async () => {
    const study = await fittedStudy(false);
    const response = await evidence(study.id);
    expect(response.body.verdict).toBe('static');
    expect(response.body.pieces[0]).toMatchObject({ kind: 'lifetime', reading: 'static' });
    expect(response.body.pieces[0].summary).toMatch(/the lifetime does not/);
  });

  it('when the pair was measured at three more temperatures, then the series trend is a piece and the series is linked', async () => {
    const study = await fittedStudy(true);
    const detail = await client.get(`/api/labs/${labId}/studies/${study.id}`);
    // K_SV following T/eta(T) of acetonitrile, as diffusion-controlled quenching does (Smoluchowski–Stokes–Einstein)
    const at = (t: number) =>
      (500 * solventDiffusionLimit('acetonitrile', t)) / solventDiffusionLimit('acetonitrile', 298.15);
    for (const temperature of [283.15, 313.15, 328.15])
      await createStudyRecord({
        labId,
        emitterId: detail.body.emitter.id,
        quencherId: detail.body.quencher.id,
        kSv: at(temperature),
        kq: at(temperature) / 1e-6,
        temperature,
      });
    const response = await evidence(study.id);
    expect(response.body.pieces.find((piece: { kind: string }) => piece.kind === 'temperature')).toMatchObject({
      reading: 'dynamic',
    });
    expect(response.body.verdict).toBe('dynamic');
    expect(response.body.series.temperatures).toEqual([283.15, 298.15, 313.15, 328.15]);
    expect(response.body.series.studyIds).toContain(study.id);
  });

  it('when a spectrum matrix shows two emitters, then the verdict says so and names the matrix', async () => {
    const study = await fittedStudy(true);
    // Two invented Gaussian bands quenched at 300 and 30 M⁻¹: K_SV changes across the emission.
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
      .post(`/api/labs/${labId}/studies/${study.id}/spectrum-matrices`)
      .set('x-csrf-token', csrf)
      .attach('file', Buffer.from(`${file}\n`), 'spectra.csv');
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    const response = await evidence(study.id);
    expect(response.body.verdict).toBe('two-emitters');
    expect(response.body.spectrumMatrixId).toBe(kept.body.id);
    expect(response.body.pieces.find((piece: { kind: string }) => piece.kind === 'wavelength').reading).toBe(
      'two-emitters',
    );
  });

  it('when equal slopes meet an absorption titration that shows a complex, then the verdict is unclear and names the conflict', async () => {
    const study = await fittedStudy(true);
    // Invented UV-vis titration: [E]0 = 20 µM, a 1:1 complex with K_a = 150 M⁻¹ absorbing to the red
    // (exact 1:1 mass balance; Beer–Lambert, 1 cm); the quencher itself does not absorb.
    const e0 = 2e-5;
    const complex = (q: number) => {
      const s = e0 + q + 1 / 150;
      return (2 * e0 * q) / (s + Math.sqrt(s * s - 4 * e0 * q));
    };
    const g = (nm: number, centre: number, width: number) => Math.exp(-(((nm - centre) / width) ** 2) / 2);
    const mM = [0, 2, 4, 6, 8, 12, 16, 20];
    const rows = Array.from({ length: 201 }, (_, i) => 350 + i).map((nm, k) => [
      nm,
      ...mM.map((c, j) =>
        (
          14000 * g(nm, 450, 25) * e0 +
          9000 * g(nm, 480, 30) * complex(c / 1000) +
          (((k * 7 + j * 3) % 5) - 2) * 4e-4
        ).toFixed(5),
      ),
    ]);
    const file = [['nm', ...mM.map((c) => `${c} mM`)], ...rows].map((row) => row.join(',')).join('\n');
    const kept = await client.agent
      .post(`/api/labs/${labId}/studies/${study.id}/absorption-titrations`)
      .set('x-csrf-token', csrf)
      .attach('file', Buffer.from(`${file}\n`), 'uv-vis.csv')
      .field('emitterConcentration', '2e-5');
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    const response = await evidence(study.id);
    const absorption = response.body.pieces.find((piece: { kind: string }) => piece.kind === 'absorption');
    expect(absorption.reading).toBe('static');
    expect(response.body.verdict).toBe('unclear');
    expect(response.body.reasons.some((reason: string) => reason.startsWith('But '))).toBe(true);
    expect(response.body.missing.map((piece: { kind: string }) => piece.kind)).not.toContain('absorption');
  });

  it('when a pair has more than 40 studies, then each series is its 40 coolest current ones (and the study itself) as the studies say', async () => {
    const tag = crypto.randomBytes(3).toString('hex');
    const emitter = await createCompound(labId, `HL-Ir-series-${tag}`, 'photocatalyst');
    const quencher = await createCompound(labId, `HL-Q-series-${tag}`, 'quencher');
    // 46 studies at 9 temperatures, so many share one and id decides their order (invented values).
    const made = [];
    for (let i = 0; i < 46; i++)
      made.push(
        await createStudyRecord({
          labId,
          emitterId: emitter.id,
          quencherId: quencher.id,
          title: `series member ${i}`,
          kSv: 100 + i,
          temperature: 280 + (i % 9) * 5,
        }),
      );
    // One of the coolest is an older revision now: out of the others' series, still in its own.
    const replaced = made[9]!;
    await testApp.sequelize.query('UPDATE studies SET is_current = false WHERE id = $1', { bind: [replaced.id] });
    const [pairRows] = (await testApp.sequelize.query(
      'SELECT id, is_current AS "isCurrent" FROM studies WHERE lab_id = $1 AND emitter_id = $2 ORDER BY temperature, id',
      { bind: [labId, emitter.id] },
    )) as [Array<{ id: string; isCurrent: boolean }>, unknown];
    // The series definition (mechanism-evidence.service.ts temperatureOf), written out here.
    const seriesOf = (id: string) =>
      pairRows
        .filter((row) => row.isCurrent || row.id === id)
        .slice(0, 40)
        .map((row) => row.id);
    const hottest = pairRows.filter((row) => row.isCurrent).at(-1)!.id;
    for (const id of [made[0]!.id, replaced.id, hottest]) {
      const response = await evidence(id);
      expect(response.status).toBe(200);
      expect(response.body.series.studyIds).toEqual(seriesOf(id));
    }
    expect(seriesOf(hottest)).not.toContain(hottest);
    expect(seriesOf(replaced.id)).toContain(replaced.id);
  });

  it('when asked, then nothing is written: the study keeps its version and its fits', async () => {
    const study = await fittedStudy(true);
    const before = await client.get(`/api/labs/${labId}/studies/${study.id}`);
    const fitsBefore = await client.get(`/api/labs/${labId}/studies/${study.id}/fits`);
    await evidence(study.id).expect(200);
    const after = await client.get(`/api/labs/${labId}/studies/${study.id}`);
    const fitsAfter = await client.get(`/api/labs/${labId}/studies/${study.id}/fits`);
    expect(after.body.version).toBe(before.body.version);
    expect(after.body.updatedAt).toBe(before.body.updatedAt);
    expect(fitsAfter.body.items).toHaveLength(fitsBefore.body.items.length);
  });

  it("when the study is another lab's, then 404, even through that member's own lab", async () => {
    const study = await fittedStudy(true);
    const second = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const stranger = await apiClient(testApp.app);
    await stranger.signIn(second.users.researcher!);
    expect((await stranger.get(`/api/labs/${labId}/studies/${study.id}/mechanism`)).status).toBe(404);
    expect((await stranger.get(`/api/labs/${second.lab.id}/studies/${study.id}/mechanism`)).status).toBe(404);
  });
});
