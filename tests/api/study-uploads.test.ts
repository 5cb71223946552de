import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

// Upload fixtures are invented test data (tests/fixtures/uploads/README.md says how each was built).
const fixture = (name: string) => fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads', name));
const testApp = await createTestApp();
let client: Awaited<ReturnType<typeof apiClient>>;
let csrf = '';
let labId = '';

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  labId = lab.id;
  client = await apiClient(testApp.app);
  csrf = (await client.signIn(users.researcher)).body.csrfToken;
});
afterAll(testApp.close);

const base = (studyId: string) => `/api/labs/${labId}/studies/${studyId}`;
const send = (studyId: string, name: string, bytes: Buffer) =>
  client.agent.post(`${base(studyId)}/uploads`).set('x-csrf-token', csrf).attach('file', bytes, name);
const newStudy = () => createStudy(client, labId, crypto.randomBytes(3).toString('hex'));

describe('POST /api/labs/:labId/studies/:studyId/uploads', () => {
  const accepted: Array<[string, number]> = [
    ['series-comma-mM.csv', 500], ['series-semicolon-decimal-comma-bom.csv', 1000], ['series-tab-ratio.tsv', 800],
    ['series-whitespace.txt', 250], ['series-workbook.xlsx', 500], ['spectrum-matrix.csv', 500],
  ];
  for (const [name, kSv] of accepted) {
    it(`when ${name} is uploaded and its mapping confirmed, then the series fits K_SV = ${kSv} M^-1 (the line it was built from)`, async () => {
      const study = await newStudy();
      const preview = await send(study.id, name, fixture(name));
      expect(preview.status, JSON.stringify(preview.body)).toBe(201);
      expect(preview.body.upload).toMatchObject({ fileName: name, parseStatus: 'parsed', sha256: crypto.createHash('sha256').update(fixture(name)).digest('hex') });
      expect((await client.get(base(study.id))).body.points).toHaveLength(0); // nothing saved before confirming
      const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, { version: study.version, mapping: preview.body.mapping });
      expect(applied.status, JSON.stringify(applied.body)).toBe(200);
      // rounding in the files (6 significant digits or more) moves K_SV by far less than 0.01 %
      expect(applied.body.latestFit.kSv).toBeCloseTo(kSv, 1);
      const download = await client.get(`${base(study.id)}/uploads/${preview.body.upload.id}/file`).buffer(true).parse((res, done) => {
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
    const again = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/preview`, { mapping: { ...preview.body.mapping, reduction: { kind: 'wavelength', at: 505 } } });
    expect(again.body.points[0].intensity).toBeCloseTo(105, 9); // (505 - 400) for the blank
  });

  it('when the same bytes are uploaded twice, then 409 names the earlier file', async () => {
    const study = await newStudy();
    await send(study.id, 'series-comma-mM.csv', fixture('series-comma-mM.csv')).expect(201);
    const again = await send(study.id, 'copy.csv', fixture('series-comma-mM.csv'));
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain('"series-comma-mM.csv"');
  });

  const unreadable: Array<[string, Buffer, RegExp]> = [
    ['bad-text-in-number.csv', fixture('bad-text-in-number.csv'), /Row 3, column 2 \("intensity"\): expected an intensity, found "abc"/],
    ['bad-negative-concentration.csv', fixture('bad-negative-concentration.csv'), /Row 3, column 1 .*expected a concentration of zero or more/],
    ['bad-header-only.csv', fixture('bad-header-only.csv'), /header row but no data rows/],
    ['bad-mismatched-columns.csv', fixture('bad-mismatched-columns.csv'), /Row 3 has 2 cells where the header has 3 columns/],
    ['bad-empty.csv', fixture('bad-empty.csv'), /The file is empty/],
    ['random.csv', Buffer.concat([Buffer.from([0]), crypto.randomBytes(2000)]), /binary data/],
    ['wrong-delimiter.csv', Buffer.from('[Q] (mM)|intensity\n0|1000\n1|800\n'), /Only one column was found/],
  ];
  for (const [name, bytes, message] of unreadable) {
    it(`when ${name} is uploaded, then 422 explains it, the file is kept as failed and the points are unchanged`, async () => {
      const study = await newStudy();
      await client.patch(`${base(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
      const response = await send(study.id, name, bytes);
      expect(response.status).toBe(422);
      expect(response.body.error.message).toMatch(message);
      const detail = (await client.get(base(study.id))).body;
      expect(detail.points).toHaveLength(6);
      expect(detail.uploads).toEqual([expect.objectContaining({ fileName: name, parseStatus: 'failed', size: bytes.length })]);
    });
  }

  const unfittable: Array<[string, RegExp]> = [
    ['bad-no-blank.csv', /no point at zero quencher concentration/],
    ['bad-two-concentrations.csv', /only 2 distinct concentrations; at least 3 are needed/],
  ];
  for (const [name, message] of unfittable) {
    it(`when ${name} is confirmed, then 422 and nothing is saved`, async () => {
      const study = await newStudy();
      await client.patch(`${base(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
      const preview = await send(study.id, name, fixture(name));
      expect(preview.status).toBe(201);
      const applied = await client.post(`${base(study.id)}/uploads/${preview.body.upload.id}/apply`, { version: 1, mapping: preview.body.mapping });
      expect(applied.status).toBe(422);
      expect(applied.body.error.message).toMatch(message);
      const detail = (await client.get(base(study.id))).body;
      expect(detail.points.map((p: { concentration: number }) => p.concentration)).toEqual(exactPoints.map((p) => p.concentration));
      expect(detail.version).toBe(1);
    });
  }

  it('when the file is larger than 20 MB, then 413 and nothing is kept', async () => {
    const study = await newStudy();
    const response = await send(study.id, 'huge.csv', Buffer.alloc(25 * 1024 * 1024, 0x31));
    expect(response.status).toBe(413);
    expect((await client.get(base(study.id))).body.uploads).toEqual([]);
  });

  it('when the file is of a type Halflight does not read, then 415', async () => {
    const study = await newStudy();
    const response = await send(study.id, 'report.pdf', Buffer.from('%PDF-1.4 invented'));
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('unsupported_type');
  });
});
