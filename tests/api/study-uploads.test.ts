import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
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
