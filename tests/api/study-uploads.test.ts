import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInResearcher, type ApiClient } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

// Upload fixtures are invented test data (tests/fixtures/uploads/README.md says how each was built).
const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads', name));
const testApp = await createTestApp();
let client: ApiClient, csrf: string, labId: string;
beforeAll(async () => {
  ({ client, csrf, labId } = await signedInResearcher(testApp));
});
afterAll(testApp.close);

const base = (studyId: string) => `/api/labs/${labId}/studies/${studyId}`;
const send = (studyId: string, name: string, bytes: Buffer) =>
  client.agent
    .post(`${base(studyId)}/uploads`)
    .set('x-csrf-token', csrf)
    .attach('file', bytes, name);
const newStudy = () => createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
/** A study holding the six exact points (version 1), for checking that bad input loses nothing. */
const studyWithPoints = async () => {
  const study = await newStudy();
  await client.patch(`${base(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
  return study;
};
/** The study still has version 1 and exactly the six points it had, value for value. */
const expectPointsUnchanged = async (studyId: string) => {
  const detail = (await client.get(base(studyId))).body;
  expect(detail.version).toBe(1);
  expect(
    detail.points.map((p: { concentration: number; intensity: number }) => [p.concentration, p.intensity]),
  ).toEqual(exactPoints.map((p) => [p.concentration, p.intensity]));
  return detail as { uploads: unknown[] };
};

describe('POST /api/labs/:labId/studies/:studyId/uploads', () => {
  const accepted: Array<[string, number]> = [
    ['series-comma-mM.csv', 500],
    ['series-semicolon-decimal-comma-bom.csv', 1000],
    ['series-tab-ratio.tsv', 800],
    ['series-whitespace.txt', 250],
    ['series-workbook.xlsx', 500],
    ['spectrum-matrix.csv', 500],
  ];
  for (const [name, kSv] of accepted) {
    it(`when ${name} is uploaded and its mapping confirmed, then the series fits K_SV = ${kSv} M^-1 (the line it was built from)`, async () => {
      const study = await newStudy();
      const preview = await send(study.id, name, fixture(name));
      expect(preview.status, JSON.stringify(preview.body)).toBe(201);
      expect(preview.body.upload).toMatchObject({
        fileName: name,
        parseStatus: 'parsed',
        sha256: crypto.createHash('sha256').update(fixture(name)).digest('hex'),
      });
      expect((await client.get(base(study.id))).body.points).toHaveLength(0); // nothing saved before confirming
      let mapping = preview.body.mapping;
      if (name === 'series-whitespace.txt') {
        // No header, so no unit: the preview asks, and applying without one saves nothing.
        expect(mapping.concentrationUnit).toBeNull();
        expect(preview.body.warnings).toEqual([expect.stringContaining('names no unit')]);
        const refused = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
          version: study.version,
          mapping,
        });
        expect(refused.status).toBe(422);
        expect(refused.body.error.code).toBe('unit_needed');
        mapping = { ...mapping, concentrationUnit: 'M' };
      }
      const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
        version: study.version,
        mapping,
      });
      expect(applied.status, JSON.stringify(applied.body)).toBe(200);
      // rounding in the files (6 significant digits or more) moves K_SV by far less than 0.01 %
      expect(applied.body.latestFit.kSv).toBeCloseTo(kSv, 1);
      const download = await client
        .get(`${base(study.id)}/uploads/${preview.body.upload.id}/file`)
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (chunk: Buffer) => chunks.push(chunk));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        });
      expect(Buffer.compare(download.body as Buffer, fixture(name))).toBe(0);
    });
  }

  it('when the spectrum is re-read at one wavelength, then the preview changes and nothing is saved', async () => {
    const study = await newStudy();
    const preview = await send(study.id, 'spectrum-matrix.csv', fixture('spectrum-matrix.csv'));
    const again = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/preview`, {
      mapping: { ...preview.body.mapping, reduction: { kind: 'wavelength', at: 505 } },
    });
    expect(again.body.points[0].intensity).toBeCloseTo(105, 9); // (505 - 400) for the blank
  });

  it('when other uploads came in between, then a preview and apply read the kept bytes again and give the same points', async () => {
    const study = await newStudy();
    const first = await send(study.id, 'spectrum-matrix.csv', fixture('spectrum-matrix.csv')).expect(201);
    // Three other files: the server keeps only the last few tables read, so the first one is read from its stored bytes again.
    for (const name of ['series-comma-mM.csv', 'series-tab-ratio.tsv', 'series-whitespace.txt'])
      await send((await newStudy()).id, name, fixture(name)).expect(201);
    const again = await client.post(`${base(study.id)}/uploads/${first.body.upload.id}/preview`, {
      mapping: first.body.mapping,
    });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.points).toEqual(first.body.points);
    const applied = await client.post(`${base(study.id)}/uploads/${first.body.upload.id}/apply`, {
      version: study.version,
      mapping: first.body.mapping,
    });
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 1); // tests/fixtures/uploads/README.md: built on K_SV = 500 M^-1
  });

  it('when a JCAMP-DX file has a block without a concentration, then the preview asks for it and the typed value completes the series', async () => {
    const study = await newStudy();
    const bytes = fixture('titration-spectra.jdx');
    const preview = await send(study.id, 'titration-spectra.jdx', bytes);
    expect(preview.status, JSON.stringify(preview.body)).toBe(201);
    expect(preview.body).toMatchObject({ format: 'JCAMP-DX, 4 spectra on different wavelength grids', rowCount: 13 });
    expect(preview.body.mapping.samples.map((s: { concentration: number }) => s.concentration)).toEqual([
      0, 1e-3, 2e-3,
    ]);
    expect(preview.body.warnings).toEqual([expect.stringContaining('"HL-Ir-7 titration point 4"')]);
    // window 450–550 nm: integral of (x - 400) is 10000, over 1 + 500 [Q] (README of the fixtures; hand-computed)
    expect(preview.body.points.map((p: { intensity: number }) => p.intensity)).toEqual(
      [10000, 10000 / 1.5, 5000].map((v) => expect.closeTo(v, 3)),
    );
    const mapping = {
      ...preview.body.mapping,
      samples: [...preview.body.mapping.samples, { column: 4, concentration: 3e-3 }],
    };
    const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: study.version,
      mapping,
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.points.map((p: { concentration: number }) => p.concentration)).toEqual([0, 1e-3, 2e-3, 3e-3]);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 3); // the line the blocks were built from
    expect(applied.body.uploads).toEqual([
      expect.objectContaining({ fileName: 'titration-spectra.jdx', parseStatus: 'applied', size: bytes.length }),
    ]);
  });

  it('when a JCAMP-DX mapping holds no spectrum with a concentration, then 422 and the earlier points stay', async () => {
    const study = await newStudy();
    await client.patch(`${base(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const preview = await send(study.id, 'titration-spectra.jdx', fixture('titration-spectra.jdx'));
    const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
      version: 1,
      mapping: { ...preview.body.mapping, samples: [] },
    });
    expect(applied.status).toBe(422);
    expect(applied.body.error.details).toEqual([{ path: 'body.mapping.samples', message: 'empty' }]);
    const detail = (await client.get(base(study.id))).body;
    expect(detail.points).toHaveLength(6);
    expect(detail.version).toBe(1);
  });

  it('when the same bytes are uploaded twice, then 409 names the earlier file', async () => {
    const study = await newStudy();
    await send(study.id, 'series-comma-mM.csv', fixture('series-comma-mM.csv')).expect(201);
    const again = await send(study.id, 'copy.csv', fixture('series-comma-mM.csv'));
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain('"series-comma-mM.csv"');
  });

  const unreadable: Array<[string, Buffer, RegExp]> = [
    [
      'bad-text-in-number.csv',
      fixture('bad-text-in-number.csv'),
      /Row 3, column 2 \("intensity"\): expected an intensity, found "abc"/,
    ],
    [
      'bad-negative-concentration.csv',
      fixture('bad-negative-concentration.csv'),
      /Row 3, column 1 .*expected a concentration of zero or more/,
    ],
    ['bad-header-only.csv', fixture('bad-header-only.csv'), /header row but no data rows/],
    [
      'bad-mismatched-columns.csv',
      fixture('bad-mismatched-columns.csv'),
      /Row 3 has 2 cells where the header has 3 columns/,
    ],
    ['bad-empty.csv', fixture('bad-empty.csv'), /The file is empty/],
    ['random.csv', Buffer.concat([Buffer.from([0]), crypto.randomBytes(2000)]), /binary data/],
    ['wrong-delimiter.csv', Buffer.from('[Q] (mM)|intensity\n0|1000\n1|800\n'), /Only one column was found/],
    ['not-jcamp.jdx', Buffer.from('wavelength,0 mM\n500,1\n'), /should start with a ##TITLE= line/],
    // random bytes without a zero byte are caught as "not UTF-8" (0xff never occurs in UTF-8)
    [
      'random-no-zero.csv',
      Buffer.concat([Buffer.from([0xff]), Buffer.from(crypto.randomBytes(2000).map((b) => b || 1))]),
      /not UTF-8 text/,
    ],
    ['random.xlsx', crypto.randomBytes(2000), /not a readable \.xlsx workbook/],
    [
      'spectrum-text-cell.csv',
      Buffer.from('wavelength (nm),0 mM,1 mM,2 mM\n500,100,80,n/a\n510,110,90,70\n'),
      /Row 2, column 4 \("2 mM"\): expected an intensity, found "n\/a"/,
    ],
  ];
  for (const [name, bytes, message] of unreadable) {
    it(`when ${name} is uploaded, then 422 explains it, the file is kept as failed and the points are unchanged`, async () => {
      const study = await studyWithPoints();
      const response = await send(study.id, name, bytes);
      expect(response.status).toBe(422);
      expect(response.body.error.message).toMatch(message);
      const detail = await expectPointsUnchanged(study.id);
      expect(detail.uploads).toEqual([
        expect.objectContaining({ fileName: name, parseStatus: 'failed', size: bytes.length }),
      ]);
    });
  }

  const unfittable: Array<[string, RegExp]> = [
    ['bad-no-blank.csv', /no point at zero quencher concentration/],
    ['bad-two-concentrations.csv', /only 2 distinct concentrations; at least 3 are needed/],
  ];
  for (const [name, message] of unfittable) {
    it(`when ${name} is confirmed, then 422, the points are unchanged and the file is kept unapplied`, async () => {
      const study = await studyWithPoints();
      const preview = await send(study.id, name, fixture(name));
      expect(preview.status).toBe(201);
      const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, {
        version: 1,
        mapping: preview.body.mapping,
      });
      expect(applied.status).toBe(422);
      expect(applied.body.error.message).toMatch(message);
      const detail = await expectPointsUnchanged(study.id);
      expect(detail.uploads).toEqual([
        expect.objectContaining({ fileName: name, parseStatus: 'parsed', size: fixture(name).length }),
      ]);
    });
  }

  // Refused before reading (multer's limit, the extension check): nothing is kept, as nothing was received whole or readable.
  it('when the file is larger than 20 MB, then 413, nothing is kept and the points are unchanged', async () => {
    const study = await studyWithPoints();
    const response = await send(study.id, 'huge.csv', Buffer.alloc(25 * 1024 * 1024, 0x31));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('file_too_large');
    expect((await expectPointsUnchanged(study.id)).uploads).toEqual([]);
  });

  it('when the file is of a type Halflight does not read, then 415, nothing is kept and the points are unchanged', async () => {
    const study = await studyWithPoints();
    const response = await send(study.id, 'report.pdf', Buffer.from('%PDF-1.4 invented'));
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('unsupported_type');
    expect((await expectPointsUnchanged(study.id)).uploads).toEqual([]);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/uploads/:uploadId/apply: points that question their unit', () => {
  // Invented series: I = 1000 / (1 + 0.25 [Q]) with [Q] = 0, 2, 4, 6, 8 and no unit in the header.
  const unitless = Buffer.from(
    `[Q],intensity\n${[0, 2, 4, 6, 8].map((q) => `${q},${1000 / (1 + 0.25 * q)}`).join('\n')}\n`,
  );

  it('when M is chosen for values up to 8, then the preview asks two questions and apply saves nothing until both are acknowledged', async () => {
    const study = await studyWithPoints();
    const sent = await send(study.id, 'unitless.csv', unitless).expect(201);
    expect(sent.body.questions).toEqual([]); // no unit yet: nothing to question, the unit is asked first
    const mapping = { ...sent.body.mapping, concentrationUnit: 'M' };
    const preview = await client.post(`${base(study.id)}/uploads/${sent.body.upload.id}/preview`, { mapping });
    // I0/I - 1 = 0.25 [Q] exactly, so K_SV reads 0.25 M^-1 in M (by construction)
    expect(preview.body.questions.map((question: { code: string }) => question.code)).toEqual([
      'concentration_above_1_molar',
      'ksv_below_1_per_molar',
    ]);
    const apply = (acknowledged?: string[]) =>
      client.post(`${base(study.id)}/uploads/${sent.body.upload.id}/apply`, {
        version: 1,
        mapping,
        ...(acknowledged ? { acknowledged } : {}),
      });
    const refused = await apply();
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('questions_open');
    expect(refused.body.error.message).toMatch(/^Nothing was saved: .*8 M.*0\.25 M⁻¹/);
    expect(refused.body.error.details).toEqual([
      { path: 'body.acknowledged', message: expect.stringContaining('concentration_above_1_molar') },
      { path: 'body.acknowledged', message: expect.stringContaining('ksv_below_1_per_molar') },
    ]);
    expect((await apply(['concentration_above_1_molar'])).body.error.details).toHaveLength(1);
    await expectPointsUnchanged(study.id);
    const applied = await apply(['concentration_above_1_molar', 'ksv_below_1_per_molar']);
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(applied.body.latestFit.kSv).toBeCloseTo(0.25, 9);
  });
});

describe('spectra read over the study window', () => {
  /**
   * An invented spectrum matrix on a 1 nm grid, 400-800 nm: a band quenched as 1 / (1 + 500 [Q])
   * (triangle, peak 100 at 600 nm, zero outside 500-700 nm) and a second band the quencher leaves
   * alone (triangle, peak 50 at 740 nm, zero outside 710-770 nm), on a flat offset. Every kink lies
   * on a grid point, so the trapezoid rule is exact and the integrals are hand-computed areas.
   */
  const spectra = (offset: number) => {
    const quenched = (nm: number) => Math.max(0, 100 - Math.abs(nm - 600));
    const untouched = (nm: number) => Math.max(0, 50 - (5 / 3) * Math.abs(nm - 740));
    const mM = [0, 1, 2, 3, 4];
    const lines = [['wavelength (nm)', ...mM.map((c) => `${c} mM`)].join(',')];
    for (let nm = 400; nm <= 800; nm++)
      lines.push([nm, ...mM.map((c) => quenched(nm) / (1 + 0.5 * c) + untouched(nm) + offset)].join(','));
    return Buffer.from(`${lines.join('\n')}\n`);
  };
  const windowStudy = () =>
    createStudy(client, labId, crypto.randomBytes(3).toString('hex'), { windowStart: 560, windowEnd: 680 });
  const applyProposed = async (bytes: Buffer, name: string, change: Record<string, unknown> = {}) => {
    const study = await windowStudy();
    const sent = await send(study.id, name, bytes);
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const applied = await client.post(`${base(study.id)}/uploads/${sent.body.upload.id}/apply`, {
      version: study.version,
      mapping: { ...sent.body.mapping, ...change },
    });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    return { study, sent, applied };
  };

  it('when the study says 560-680 nm, then the proposal integrates there and K_SV is that of the quenched band alone', async () => {
    const { sent, applied } = await applyProposed(spectra(0), 'two-bands.csv');
    expect(sent.body.mapping).toMatchObject({ reduction: { kind: 'window', start: 560, end: 680 }, baseline: null });
    // Blank over 560-680 nm (trapezoid, exact here): quenched band (60+100)/2 x 40 + (100+20)/2 x 80 = 3200 + 4800
    // = 8000; the untouched band is zero below 710 nm. So I0/I = 1 + 500 [Q] exactly and K_SV = 500 M^-1.
    // (Over the whole 400-800 nm the blank would be 10000 + 1500 and I0/I curve below that line.)
    expect(sent.body.points[0].intensity).toBeCloseTo(8000, 9);
    expect(applied.body.latestFit.kSv).toBeCloseTo(500, 6);
  });

  it('when the spectra sit on a 40-count offset and a baseline region is subtracted, then K_SV is the same as without the offset', async () => {
    const plain = await applyProposed(spectra(0), 'no-offset.csv');
    // 780-800 nm holds only the offset (both bands are zero there): its mean, 40 counts, comes off every reading.
    const { applied } = await applyProposed(spectra(40), 'offset.csv', { baseline: { start: 780, end: 800 } });
    expect(applied.body.latestFit.kSv).toBeCloseTo(plain.applied.body.latestFit.kSv, 9);
    // Without the baseline the offset adds 40 x 120 = 4800 to every integral and K_SV falls well below 500.
    const { applied: offsetOnly } = await applyProposed(spectra(40), 'offset-kept.csv');
    expect(offsetOnly.body.latestFit.kSv).toBeLessThan(400);
  });

  it('when spectra are applied, then the upload, the history and the report say how they were read', async () => {
    const { study, applied } = await applyProposed(spectra(40), 'stated.csv', { baseline: { start: 780, end: 800 } });
    const reading = 'spectra integrated over 560–680 nm (trapezoid), baseline 780–800 nm subtracted (its mean)';
    expect(applied.body.uploads).toEqual([expect.objectContaining({ fileName: 'stated.csv', reading })]);
    const history = await client.get(`${base(study.id)}/history`).expect(200);
    const taken = history.body.events.find((event: { action: string }) => event.action === 'study_points_from_upload');
    expect(taken.details).toMatchObject({
      reading,
      reduction: { kind: 'window', start: 560, end: 680 },
      baseline: { start: 780, end: 800 },
    });
    const pdf = await client.agent
      .get(`${base(study.id)}/report.pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    const text = (await parser.getText().finally(() => parser.destroy())).text.replace(/\s+/g, ' ');
    expect(text).toContain(`stated.csv`);
    expect(text).toContain(`read as ${reading}`);
  });
});
