import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pointAt } from '@shared/schemas/study-points';
import { AuditEvent, Study } from '../../server/models';
import { absorptionEvidenceForStudy } from '../../server/services/mechanism/absorption-titrations.service';
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
 * UV-vis titrations invented for the test, on a 1 nm grid from 350 to 550 nm, σ = 0.001:
 * A = ε_E [E]0 + Δε [EQ] + ε_Q [Q] with [E]0 = 20 µM, K_a = 150 M^-1 (exact 1:1 balance), a
 * complex band to the red and a quencher that absorbs near 360 nm (Beer–Lambert, l = 1 cm).
 */
const wavelengths = Array.from({ length: 201 }, (_, i) => 350 + i);
const gauss = (nm: number, centre: number, width: number) => Math.exp(-(((nm - centre) / width) ** 2) / 2);
const epsilonE = (nm: number) => 14000 * gauss(nm, 450, 25);
const deltaEpsilon = (nm: number) => 9000 * gauss(nm, 480, 30) - 0.6 * epsilonE(nm);
const epsilonQ = (nm: number) => 20 * gauss(nm, 360, 20);
const e0 = 2e-5;
const concentrationsMm = [0, 2, 4, 6, 8, 12, 16, 20];
function complex(q: number, k: number): number {
  const s = e0 + q + 1 / k;
  return (2 * e0 * q) / (s + Math.sqrt(s * s - 4 * e0 * q));
}

function titrationFile(options: { complexes?: boolean; edit?: (cells: string[][]) => void } = {}): Buffer {
  const normal = seededNormal(17);
  const rows = wavelengths.map((nm) => [
    String(nm),
    ...concentrationsMm.map((mM) => {
      const q = mM / 1000;
      const eq = options.complexes === false ? 0 : complex(q, 150);
      return (epsilonE(nm) * e0 + deltaEpsilon(nm) * eq + epsilonQ(nm) * q + 0.001 * normal()).toFixed(5);
    }),
  ]);
  const cells = [['wavelength (nm)', ...concentrationsMm.map((mM) => `${mM} mM`)], ...rows];
  options.edit?.(cells);
  return Buffer.from(`${cells.map((row) => row.join(',')).join('\n')}\n`);
}
const quencherFile = (grid = wavelengths) =>
  Buffer.from(`wavelength (nm),ε (M-1 cm-1)\n${grid.map((nm) => `${nm},${epsilonQ(nm).toFixed(5)}`).join('\n')}\n`);

const url = (studyId: string) => `/api/labs/${labId}/studies/${studyId}/absorption-titrations`;
const newStudy = (extra: Record<string, unknown> = {}) =>
  createStudy(client, labId, crypto.randomBytes(3).toString('hex'), extra);
function send(
  path: string,
  file: Buffer,
  fields: Record<string, string> = {},
  quencher: Buffer | null = quencherFile(),
  name = 'uv-vis.csv',
) {
  let request = client.agent.post(path).set('x-csrf-token', csrf).attach('file', file, name);
  if (quencher) request = request.attach('quencher', quencher, 'quencher.csv');
  for (const [key, value] of Object.entries(fields)) request = request.field(key, value);
  return request;
}

describe('POST /api/labs/:labId/studies/:studyId/absorption-titrations/preview', () => {
  it('when a complex forms, then the preview flags it and gives K_a both ways, and nothing is kept', async () => {
    const study = await newStudy();
    const answer = await send(`${url(study.id)}/preview`, titrationFile(), { emitterConcentration: '2e-5' });
    expect(answer.status, JSON.stringify(answer.body).slice(0, 500)).toBe(200);
    expect(answer.body.quencher).toEqual({ header: 'ε (M-1 cm-1)', kind: 'absorptivity', concentration: null });
    expect(answer.body.analysis.quencherCorrection).toBe('absorptivity');
    expect(answer.body.analysis.flags.map((flag: { code: string }) => flag.code)).toEqual(['ABSORPTION_CHANGES']);
    const isotherm = answer.body.analysis.binding.isotherm.fit;
    // K_a the spectra were made with (invented): 150 M^-1, recovered within 2 % and 3 SE.
    expect(Math.abs(isotherm.kA.value / 150 - 1)).toBeLessThan(0.02);
    expect(Math.abs(isotherm.kA.value - 150)).toBeLessThan(3 * isotherm.kA.standardError);
    expect(answer.body.analysis.binding.benesiHildebrand.fit.kA.value).toBeGreaterThan(0);
    expect(answer.body.plot.spectra).toHaveLength(concentrationsMm.length);
    expect(answer.body.plot.spectra[0].differences).toHaveLength(201);
    expect(answer.body.comparison.kS).toBeNull();
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/absorption-titrations', () => {
  it('when kept, then it is listed with both files and their SHA-256, and the list compares K_a with K_S', async () => {
    // The study's own Stern–Volmer points: I0/I = (1 + 50[Q])(1 + 150[Q]) (invented), fitted with the combined model.
    const study = await newStudy({ fitModel: 'static-dynamic' });
    const points = [0, 0.002, 0.004, 0.006, 0.008, 0.012, 0.016, 0.02].map((q) => ({
      ...pointAt(q),
      intensity: 1000 / ((1 + 50 * q) * (1 + 150 * q)),
    }));
    const patched = await client.patch(`/api/labs/${labId}/studies/${study.id}/points`, {
      version: study.version,
      points,
    });
    expect(patched.status, JSON.stringify(patched.body).slice(0, 400)).toBe(200);
    const file = titrationFile();
    const quencher = quencherFile();
    const answer = await send(url(study.id), file, { emitterConcentration: '2e-5', bandWidth: '10' }, quencher);
    expect(answer.status, JSON.stringify(answer.body).slice(0, 500)).toBe(201);
    // SHA-256 by node:crypto over the bytes sent.
    expect(answer.body.file.sha256).toBe(crypto.createHash('sha256').update(file).digest('hex'));
    expect(answer.body.quencherFile.sha256).toBe(crypto.createHash('sha256').update(quencher).digest('hex'));
    expect(answer.body.options).toEqual({
      bandWidth: 10,
      pathLength: 1,
      emitterConcentration: 2e-5,
      subtractQuencher: true,
      associationFit: 'isotherm',
    });
    // K_S = 150 M^-1 by construction; K_a from absorption is 150 M^-1 too: they agree.
    expect(answer.body.comparison.kS.value).toBeCloseTo(150, 3);
    expect(answer.body.comparison.isotherm.agree).toBe(true);

    const list = await client.agent.get(url(study.id));
    expect(list.status).toBe(200);
    expect(list.body.items.map((item: { id: string }) => item.id)).toEqual([answer.body.id]);
    // What the combined mechanism verdict reads: the change, in words, and K_a of the isotherm.
    const lab = { id: labId, name: 'test', isDemo: false, role: 'viewer' as const, membershipId: crypto.randomUUID() };
    const evidence = await absorptionEvidenceForStudy(lab, study.id);
    expect(evidence).toMatchObject({ changed: true, detail: expect.stringMatching(/ground-state complex may form/) });
    expect(evidence!.associationConstant!.value).toBe(answer.body.analysis.binding.isotherm.fit.kA.value);
    expect(await absorptionEvidenceForStudy(lab, (await newStudy()).id)).toBeNull();
    // The emission matrices of the same table do not show absorption titrations.
    const emission = await client.agent.get(`/api/labs/${labId}/studies/${study.id}/spectrum-matrices`);
    expect(emission.body.items).toEqual([]);
  });

  it('when there is no change beyond the sum of the parts, then nothing is flagged and no K_a is given', async () => {
    const study = await newStudy();
    const answer = await send(url(study.id), titrationFile({ complexes: false }));
    expect(answer.status).toBe(201);
    expect(answer.body.analysis.flags).toEqual([]);
    expect(answer.body.analysis.binding).toBeNull();
  });

  it("when the quencher's spectrum is on another grid, then 422 says so and nothing is kept", async () => {
    const study = await newStudy();
    const answer = await send(url(study.id), titrationFile(), {}, quencherFile(wavelengths.map((nm) => nm + 0.5)));
    expect(answer.status).toBe(422);
    expect(answer.body.error.message).toMatch(/different wavelength grid/);
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
  });

  it('when a spectrum lacks readings of the grid, then 422 names it', async () => {
    const study = await newStudy();
    const answer = await send(
      url(study.id),
      titrationFile({
        edit: (cells) => {
          cells[40]![4] = '';
        },
      }),
    );
    expect(answer.status).toBe(422);
    expect(answer.body.error.message).toMatch(/"6 mM" has no reading at 389 nm .*different wavelength grids/);
  });

  it('when there are fewer than 3 concentrations above 0, then 422 names the concentrations', async () => {
    const study = await newStudy();
    const answer = await send(
      url(study.id),
      titrationFile({
        edit: (cells) => {
          for (const row of cells) row.splice(4);
        },
      }),
    );
    expect(answer.status).toBe(422);
    expect(answer.body.error.message).toMatch(/3 or more different quencher concentrations above 0, got 2/);
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
  });

  it('when the path length is negative or the band width too wide, then 400 names each field', async () => {
    const study = await newStudy();
    const answer = await send(url(study.id), titrationFile(), { pathLength: '-1', bandWidth: '500' });
    expect(answer.status).toBe(400);
    expect(answer.body.error.details).toEqual(
      expect.arrayContaining([
        { path: 'body.pathLength', message: 'must be greater than 0 cm' },
        { path: 'body.bandWidth', message: 'must be at most 50 nm' },
      ]),
    );
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
  });

  it('when the quencher file names neither a concentration nor ε, then 422 names its column', async () => {
    const study = await newStudy();
    const bad = Buffer.from(`nm,absorbance\n${wavelengths.map((nm) => `${nm},0.1`).join('\n')}\n`);
    const answer = await send(url(study.id), titrationFile(), {}, bad);
    expect(answer.status).toBe(422);
    expect(answer.body.error.message).toMatch(/"absorbance" names neither its concentration/);
  });
});

describe('DELETE /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId', () => {
  it('when discarded, then the titration and its files are gone', async () => {
    const study = await newStudy();
    const kept = await send(url(study.id), titrationFile());
    expect(kept.status).toBe(201);
    const gone = await client.agent.delete(`${url(study.id)}/${kept.body.id}`).set('x-csrf-token', csrf);
    expect(gone.status).toBe(200);
    // The verdict without spectra or fit is unclear (combineMechanismEvidence); the titration read static before.
    expect(gone.body.verdict).toMatchObject({ before: 'static', after: 'unclear' });
    const audit = await AuditEvent.findOne({ where: { action: 'absorption_titration_discarded', targetId: study.id } });
    expect(audit!.details).toMatchObject({
      absorptionTitrationId: kept.body.id,
      filesRemoved: [kept.body.file.id, kept.body.quencherFile.id],
      flags: ['ABSORPTION_CHANGES'],
      verdict: { before: 'static', after: 'unclear' },
    });
    expect((await client.agent.get(url(study.id))).body.items).toEqual([]);
    const file = await client.agent.get(`/api/labs/${labId}/mechanism-files/${kept.body.file.id}`);
    expect(file.status).toBe(404);
    const again = await client.agent.delete(`${url(study.id)}/${kept.body.id}`).set('x-csrf-token', csrf);
    expect(again.status).toBe(404);
  });
});

describe('POST /api/labs/:labId/studies/:studyId/revisions with an absorption titration', () => {
  it('when an approved study gets a new revision, then the revision carries the titration on the same files, and discarding it there leaves the approved one whole', async () => {
    const study = await newStudy();
    const kept = await send(url(study.id), titrationFile(), { emitterConcentration: '2e-5' });
    expect(kept.status, JSON.stringify(kept.body).slice(0, 400)).toBe(201);
    // Approval is the reviewers' (tests/api/studies.test.ts walks it); here the state is set directly.
    await Study.update({ status: 'approved' }, { where: { id: study.id } });
    const revision = await client.agent
      .post(`/api/labs/${labId}/studies/${study.id}/revisions`)
      .set('x-csrf-token', csrf);
    expect(revision.status, JSON.stringify(revision.body).slice(0, 400)).toBe(201);
    const copies = (await client.agent.get(url(revision.body.id))).body.items;
    expect(copies).toHaveLength(1);
    const { id: _keptId, studyId: _keptStudy, ...same } = kept.body;
    expect(copies[0]).toMatchObject({ ...same, studyId: revision.body.id });
    expect(copies[0].id).not.toBe(kept.body.id);
    const audit = await AuditEvent.findOne({ where: { action: 'study_revision_started', targetId: revision.body.id } });
    expect(audit!.details).toMatchObject({ copied: { decaySets: 0, spectrumMatrices: 0, absorptionTitrations: 1 } });

    const gone = await client.agent.delete(`${url(revision.body.id)}/${copies[0].id}`).set('x-csrf-token', csrf);
    expect(gone.status, JSON.stringify(gone.body)).toBe(200);
    expect((await client.agent.get(url(revision.body.id))).body.items).toEqual([]);
    // The approved revision still has its titration and both files, byte for byte.
    const before = (await client.agent.get(url(study.id))).body.items;
    expect(before.map((item: { id: string }) => item.id)).toEqual([kept.body.id]);
    for (const file of [kept.body.file, kept.body.quencherFile]) {
      const download = await client.agent.get(`/api/labs/${labId}/mechanism-files/${file.id}`);
      expect(download.status).toBe(200);
    }
  });
});

describe('POST /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId/reanalyse', () => {
  const reanalyse = (studyId: string, titrationId: string, body: object) =>
    client.agent
      .post(`${url(studyId)}/${titrationId}/reanalyse`)
      .set('x-csrf-token', csrf)
      .send(body);
  const settings = {
    bandWidth: 10,
    pathLength: 1,
    emitterConcentration: null,
    subtractQuencher: false,
    associationFit: 'benesi-hildebrand',
  };

  it("when analysed again without the quencher's file and with Benesi–Hildebrand, then it is stored so, the verdict reads that K_a and the change is audited", async () => {
    const study = await newStudy();
    const kept = await send(url(study.id), titrationFile(), { emitterConcentration: '2e-5' });
    expect(kept.status).toBe(201);
    const answer = await reanalyse(study.id, kept.body.id, settings);
    expect(answer.status, JSON.stringify(answer.body).slice(0, 400)).toBe(200);
    const { titration } = answer.body;
    expect(titration.options).toEqual({
      bandWidth: 10,
      pathLength: 1,
      subtractQuencher: false,
      associationFit: 'benesi-hildebrand',
    });
    expect(titration.analysis.quencherCorrection).toBe('none');
    expect(titration.quencher).toBeNull();
    // The quencher's file stays kept with the titration, only not taken out.
    expect(titration.quencherFile).toEqual(kept.body.quencherFile);
    // Without [E]0 the isotherm takes [Q] in large excess.
    // Left in, the quencher's own band (ε_Q peaks at 360 nm in the invented spectra) reads as the largest change,
    // growing in proportion to [Q]: no isotherm shows, which is why its absorbance is taken out.
    expect(titration.analysis.binding.band.centre).toBeGreaterThan(355);
    expect(titration.analysis.binding.band.centre).toBeLessThan(370);
    expect(titration.analysis.binding.isotherm.fit).toBeNull();
    const evidence = (await client.agent.get(`/api/labs/${labId}/studies/${study.id}/mechanism`)).body;
    expect(answer.body.verdict).toEqual({ before: 'static', after: evidence.verdict, reasons: evidence.reasons });
    const absorption = evidence.pieces.find((piece: { kind: string }) => piece.kind === 'absorption');
    // The K_a the verdict reads is the Benesi–Hildebrand one of the stored analysis.
    expect(absorption.numbers[0].value).toBe(titration.analysis.binding.benesiHildebrand.fit.kA.value);
    expect(absorption.summary).toMatch(/K_a from the Benesi–Hildebrand line/);
    const listed = (await client.agent.get(url(study.id))).body.items;
    expect(listed[0]).toMatchObject({ id: kept.body.id, options: titration.options, analysis: titration.analysis });
    const audit = await AuditEvent.findOne({
      where: { action: 'absorption_titration_reanalysed', targetId: study.id },
    });
    expect(audit!.details).toMatchObject({
      absorptionTitrationId: kept.body.id,
      before: {
        settings: { bandWidth: 5, emitterConcentration: 2e-5, subtractQuencher: true, associationFit: 'isotherm' },
        kA: { value: kept.body.analysis.binding.isotherm.fit.kA.value },
      },
      after: {
        settings: { bandWidth: 10, subtractQuencher: false, associationFit: 'benesi-hildebrand' },
        kA: { value: titration.analysis.binding.benesiHildebrand.fit.kA.value },
      },
      verdict: { before: 'static', after: evidence.verdict },
    });

    // The isotherm chosen where it gives no K_a: the verdict says so and reads the other fit's.
    const fallback = await reanalyse(study.id, kept.body.id, { ...settings, associationFit: 'isotherm' });
    expect(fallback.status).toBe(200);
    const fallbackPiece = (await client.agent.get(`/api/labs/${labId}/studies/${study.id}/mechanism`)).body.pieces.find(
      (piece: { kind: string }) => piece.kind === 'absorption',
    );
    expect(fallbackPiece.summary).toMatch(/The 1:1 isotherm gave no K_a \(.*\); K_a from the Benesi–Hildebrand line/);

    // Back to the quencher's file taken out, read from the kept file again: K_a = 150 M^-1 (invented) within 2 %.
    const back = await reanalyse(study.id, kept.body.id, {
      ...settings,
      emitterConcentration: 2e-5,
      subtractQuencher: true,
      associationFit: 'isotherm',
    });
    expect(back.status).toBe(200);
    expect(back.body.titration.analysis.quencherCorrection).toBe('absorptivity');
    expect(Math.abs(back.body.titration.analysis.binding.isotherm.fit.kA.value / 150 - 1)).toBeLessThan(0.02);
  });

  it('when the quencher is to be taken out of a titration kept without its file, then 422 names the field and nothing changes', async () => {
    const study = await newStudy();
    const kept = await send(url(study.id), titrationFile(), {}, null);
    expect(kept.status).toBe(201);
    const answer = await reanalyse(study.id, kept.body.id, { ...settings, subtractQuencher: true });
    expect(answer.status).toBe(422);
    expect(answer.body.error.details).toEqual([
      { path: 'body.subtractQuencher', message: 'the titration has no quencher file' },
    ]);
    expect((await client.agent.get(url(study.id))).body.items[0].analysis).toEqual(kept.body.analysis);
  });

  it('when the settings are missing or not valid, then 400 names each field', async () => {
    const study = await newStudy();
    const kept = await send(url(study.id), titrationFile());
    const answer = await reanalyse(study.id, kept.body.id, { bandWidth: 80, pathLength: 0, associationFit: 'guess' });
    expect(answer.status).toBe(400);
    expect(answer.body.error.details.map((detail: { path: string }) => detail.path).sort()).toEqual([
      'body.associationFit',
      'body.bandWidth',
      'body.emitterConcentration',
      'body.pathLength',
      'body.subtractQuencher',
    ]);
  });
});
