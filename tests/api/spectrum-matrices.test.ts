import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Study } from '../../server/models';
import { signedInResearcher, type ApiClient } from '../support/accounts';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';
import { seededNormal } from '../unit/engine/support/seeded-random';

const testApp = await createTestApp();
let client: ApiClient, csrf: string, labId: string;
beforeAll(async () => {
  ({ client, csrf, labId } = await signedInResearcher(testApp));
});
afterAll(testApp.close);

/*
 * Emission spectra invented for the test: Gaussian bands on a 1 nm grid, 5 counts of noise.
 * One emitter quenched with K_SV = 150 M^-1; or two emitters, 300 and 30 M^-1 (Lakowicz, 3rd ed.,
 * ch. 8: only the second can give a K_SV that changes with wavelength).
 */
const wavelengths = Array.from({ length: 201 }, (_, i) => 400 + i);
const concentrationsMm = [0, 0, 2, 4, 6, 8, 10];
const band = (nm: number, centre: number, width: number) => 1000 * Math.exp(-(((nm - centre) / width) ** 2) / 2);
const oneEmitter = (nm: number, mM: number) => band(nm, 450, 20) / (1 + 0.15 * mM);
const twoEmitters = (nm: number, mM: number) =>
  band(nm, 430, 15) / (1 + 0.3 * mM) + band(nm, 500, 15) / (1 + 0.03 * mM);

function matrixFile(signal: (nm: number, mM: number) => number, edit?: (cells: string[][]) => void): Buffer {
  const normal = seededNormal(42);
  const rows = wavelengths.map((nm) => [
    String(nm),
    ...concentrationsMm.map((mM) => (signal(nm, mM) + 5 * normal()).toFixed(3)),
  ]);
  const headers = ['wavelength (nm)', ...concentrationsMm.map((mM, i) => `[Q] ${mM} mM rep ${i + 1}`)];
  const cells = [headers, ...rows];
  edit?.(cells);
  return Buffer.from(`${cells.map((row) => row.join(',')).join('\n')}\n`);
}

const url = (studyId: string) => `/api/labs/${labId}/studies/${studyId}/spectrum-matrices`;
const newStudy = () => createStudy(client, labId, crypto.randomBytes(3).toString('hex'));
function send(studyId: string, file: Buffer, bandWidth?: string, name = 'spectra.csv') {
  const request = client.agent.post(url(studyId)).set('x-csrf-token', csrf).attach('file', file, name);
  return bandWidth === undefined ? request : request.field('bandWidth', bandWidth);
}

describe('POST /api/labs/:labId/studies/:studyId/spectrum-matrices', () => {
  it('when two emitters are quenched differently, then K_SV varies across the bands and the file is kept with its SHA-256', async () => {
    const study = await newStudy();
    const file = matrixFile(twoEmitters);
    const answer = await send(study.id, file, '10');
    expect(answer.status, JSON.stringify(answer.body)).toBe(201);
    expect(answer.body.reading).toMatchObject({ firstWavelength: 400, lastWavelength: 600, wavelengthCount: 201 });
    expect(answer.body.reading.samples.map((s: { concentration: number }) => s.concentration)).toEqual(
      concentrationsMm.map((mM) => mM / 1000),
    );
    expect(answer.body.analysis.bandWidth).toBe(10);
    expect(answer.body.analysis.homogeneity.homogeneous).toBe(false);
    expect(answer.body.analysis.flags.map((f: { code: string }) => f.code)).toEqual(['KSV_VARIES_WITH_WAVELENGTH']);
    expect(answer.body.analysis.components.significant).toBe(2);
    expect(answer.body.plot.spectra).toHaveLength(concentrationsMm.length);
    // SHA-256 by node:crypto over the bytes sent.
    expect(answer.body.file.sha256).toBe(crypto.createHash('sha256').update(file).digest('hex'));

    const list = await client.agent.get(url(study.id));
    expect(list.status).toBe(200);
    expect(list.body.items.map((m: { id: string }) => m.id)).toEqual([answer.body.id]);
    const download = await client.agent
      .get(`/api/labs/${labId}/mechanism-files/${answer.body.file.id}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(download.status).toBe(200);
    expect(Buffer.compare(download.body as Buffer, file)).toBe(0);
  });

  it('when one emitter is quenched and no width is given, then 10 nm bands agree on K_SV = 150 M^-1', async () => {
    const study = await newStudy();
    const answer = await send(study.id, matrixFile(oneEmitter));
    expect(answer.status, JSON.stringify(answer.body)).toBe(201);
    const { analysis } = answer.body;
    expect(analysis.bandWidth).toBe(10);
    expect(analysis.flags).toEqual([]);
    expect(analysis.homogeneity.homogeneous).toBe(true);
    // The K_SV the spectra were made with (invented): 150 M^-1, within 3 SE of the weighted mean.
    expect(Math.abs(analysis.homogeneity.weightedMean - 150)).toBeLessThan(
      3 * analysis.homogeneity.weightedMeanStandardError,
    );
  });

  it('when the spectra are on different wavelength grids, then 422 names the spectrum and keeps nothing', async () => {
    const study = await newStudy();
    const file = matrixFile(oneEmitter, (cells) => {
      cells[51]![3] = '';
    });
    const answer = await send(study.id, file);
    expect(answer.status).toBe(422);
    expect(answer.body.error.message).toMatch(
      /"\[Q\] 2 mM rep 3" has no reading at 450 nm .*different wavelength grids/,
    );
    expect(answer.body.error.details[0].path).toBe('file.column [Q] 2 mM rep 3');
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
  });

  it('when a header names no concentration, or there is no blank, then 422 says which', async () => {
    const study = await newStudy();
    const noConcentration = await send(
      study.id,
      matrixFile(oneEmitter, (cells) => {
        cells[0]![2] = 'second blank';
      }),
    );
    expect(noConcentration.status).toBe(422);
    expect(noConcentration.body.error.message).toMatch(/"second blank" names no quencher concentration/);
    const noBlank = await send(
      study.id,
      matrixFile(oneEmitter, (cells) => {
        cells[0]![1] = '1 mM';
        cells[0]![2] = '1.5 mM';
      }),
    );
    expect(noBlank.status).toBe(422);
    expect(noBlank.body.error.message).toMatch(/no spectrum at \[Q\] = 0/);
  });

  it('when the band width is negative, then 400 names the field', async () => {
    const study = await newStudy();
    const answer = await send(study.id, matrixFile(oneEmitter), '-1');
    expect(answer.status).toBe(400);
    expect(answer.body.error.details).toEqual([
      { path: 'body.bandWidth', message: expect.stringMatching(/0 .* or more/) },
    ]);
  });

  it('when the file type is not one Halflight reads, then 415', async () => {
    const study = await newStudy();
    const answer = await send(study.id, matrixFile(oneEmitter), undefined, 'spectra.pdf');
    expect(answer.status).toBe(415);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/revisions with a spectrum matrix', () => {
  it('when an approved study gets a new revision, then the revision carries its matrices, newest first, on the same files', async () => {
    const study = await newStudy();
    const older = await send(study.id, matrixFile(oneEmitter), '10', 'one.csv');
    expect(older.status).toBe(201);
    const newer = await send(study.id, matrixFile(twoEmitters), '5', 'two.csv');
    expect(newer.status).toBe(201);
    // Approval is the reviewers' (tests/api/studies.test.ts walks it); here the state is set directly.
    await Study.update({ status: 'approved' }, { where: { id: study.id } });
    const revision = await client.agent
      .post(`/api/labs/${labId}/studies/${study.id}/revisions`)
      .set('x-csrf-token', csrf);
    expect(revision.status, JSON.stringify(revision.body).slice(0, 400)).toBe(201);
    const copies = (await client.agent.get(url(revision.body.id))).body.items;
    expect(copies.map((m: { title: string }) => m.title)).toEqual(['two.csv', 'one.csv']);
    for (const [copy, original] of [
      [copies[0], newer.body],
      [copies[1], older.body],
    ]) {
      const { id: _id, studyId: _studyId, ...same } = original;
      expect(copy).toMatchObject({ ...same, studyId: revision.body.id });
      expect(copy.id).not.toBe(original.id);
    }
    // The approved revision keeps its own two, untouched.
    const before = (await client.agent.get(url(study.id))).body.items;
    expect(before.map((m: { id: string }) => m.id)).toEqual([newer.body.id, older.body.id]);
  });
});

const evidenceOf = async (studyId: string) =>
  (await client.agent.get(`/api/labs/${labId}/studies/${studyId}/mechanism`).expect(200)).body;

describe('POST /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId/reanalyse', () => {
  it('when a kept matrix is analysed again at another band width, then it is stored so, the verdict before and after comes back and the change is audited', async () => {
    const study = await newStudy();
    const kept = await send(study.id, matrixFile(twoEmitters), '10');
    expect(kept.status).toBe(201);
    const answer = await client.agent
      .post(`${url(study.id)}/${kept.body.id}/reanalyse`)
      .set('x-csrf-token', csrf)
      .send({ bandWidth: 5 });
    expect(answer.status, JSON.stringify(answer.body).slice(0, 400)).toBe(200);
    expect(answer.body.matrix.analysis.bandWidth).toBe(5);
    // 400–600 nm in 5 nm bands against 10 nm bands: about twice as many.
    expect(answer.body.matrix.analysis.bands.length).toBeGreaterThan(1.8 * kept.body.analysis.bands.length);
    // Two emitters quenched at 300 and 30 M^-1 (invented) still differ across the narrower bands.
    expect(answer.body.matrix.analysis.flags.map((f: { code: string }) => f.code)).toContain(
      'KSV_VARIES_WITH_WAVELENGTH',
    );
    const evidence = await evidenceOf(study.id);
    expect(answer.body.verdict).toEqual({ before: 'two-emitters', after: evidence.verdict, reasons: evidence.reasons });
    const listed = (await client.agent.get(url(study.id))).body.items;
    expect(listed[0]).toMatchObject({ id: kept.body.id, analysis: answer.body.matrix.analysis });
    expect(listed[0].file).toEqual(kept.body.file);
    const audit = await AuditEvent.findOne({ where: { action: 'spectrum_matrix_reanalysed', targetId: study.id } });
    expect(audit!.details).toMatchObject({
      spectrumMatrixId: kept.body.id,
      before: { bandWidth: 10, flags: ['KSV_VARIES_WITH_WAVELENGTH'] },
      after: { bandWidth: 5 },
      verdict: { before: 'two-emitters', after: evidence.verdict },
    });
  });

  it('when the band width is not valid, the matrix unknown or the study approved, then 400, 404 and 409, and nothing changes', async () => {
    const study = await newStudy();
    const kept = await send(study.id, matrixFile(oneEmitter), '10');
    const reanalyse = (matrixId: string, body: object) =>
      client.agent
        .post(`${url(study.id)}/${matrixId}/reanalyse`)
        .set('x-csrf-token', csrf)
        .send(body);
    const bad = await reanalyse(kept.body.id, { bandWidth: -2 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details).toEqual([
      { path: 'body.bandWidth', message: expect.stringMatching(/0 .* or more/) },
    ]);
    expect((await reanalyse(crypto.randomUUID(), { bandWidth: 5 })).status).toBe(404);
    await Study.update({ status: 'approved' }, { where: { id: study.id } });
    const locked = await reanalyse(kept.body.id, { bandWidth: 5 });
    expect(locked.status).toBe(409);
    const listed = (await client.agent.get(url(study.id))).body.items;
    expect(listed[0].analysis).toEqual(kept.body.analysis);
  });
});

describe('DELETE /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId', () => {
  it('when the newest matrix is discarded, then the verdict falls back to the older one, its file is gone and the audit keeps its name and hash', async () => {
    const study = await newStudy();
    const older = await send(study.id, matrixFile(oneEmitter), '10', 'one.csv');
    const newer = await send(study.id, matrixFile(twoEmitters), '10', 'two.csv');
    expect((await evidenceOf(study.id)).spectrumMatrixId).toBe(newer.body.id);
    const gone = await client.agent.delete(`${url(study.id)}/${newer.body.id}`).set('x-csrf-token', csrf);
    expect(gone.status, JSON.stringify(gone.body)).toBe(200);
    const evidence = await evidenceOf(study.id);
    expect(evidence.spectrumMatrixId).toBe(older.body.id);
    expect(gone.body.verdict).toEqual({ before: 'two-emitters', after: evidence.verdict, reasons: evidence.reasons });
    expect(evidence.verdict).not.toBe('two-emitters');
    expect((await client.agent.get(url(study.id))).body.items.map((m: { id: string }) => m.id)).toEqual([
      older.body.id,
    ]);
    expect((await client.agent.get(`/api/labs/${labId}/mechanism-files/${newer.body.file.id}`)).status).toBe(404);
    const audit = await AuditEvent.findOne({ where: { action: 'spectrum_matrix_discarded', targetId: study.id } });
    expect(audit!.details).toMatchObject({
      spectrumMatrixId: newer.body.id,
      file: { id: newer.body.file.id, fileName: 'two.csv', sha256: newer.body.file.sha256 },
      fileRemoved: true,
      flags: ['KSV_VARIES_WITH_WAVELENGTH'],
      verdict: { before: 'two-emitters', after: evidence.verdict },
    });
    const again = await client.agent.delete(`${url(study.id)}/${newer.body.id}`).set('x-csrf-token', csrf);
    expect(again.status).toBe(404);
  });

  it('when a revision discards its copy, then the approved revision keeps the matrix and its file', async () => {
    const study = await newStudy();
    const kept = await send(study.id, matrixFile(oneEmitter));
    await Study.update({ status: 'approved' }, { where: { id: study.id } });
    const revision = await client.agent
      .post(`/api/labs/${labId}/studies/${study.id}/revisions`)
      .set('x-csrf-token', csrf);
    const [copy] = (await client.agent.get(url(revision.body.id))).body.items;
    const gone = await client.agent.delete(`${url(revision.body.id)}/${copy.id}`).set('x-csrf-token', csrf);
    expect(gone.status).toBe(200);
    expect((await client.agent.get(url(study.id))).body.items.map((m: { id: string }) => m.id)).toEqual([kept.body.id]);
    expect((await client.agent.get(`/api/labs/${labId}/mechanism-files/${kept.body.file.id}`)).status).toBe(200);
    const audit = await AuditEvent.findOne({
      where: { action: 'spectrum_matrix_discarded', targetId: revision.body.id },
    });
    expect(audit!.details).toMatchObject({ fileRemoved: false });
  });
});
