import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { quenchingFractions } from '../../shared/engine';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let labId = '';
let researcher: Awaited<ReturnType<typeof apiClient>>;
let other: Awaited<ReturnType<typeof apiClient>>;
const ids = { emitter: '', amine: '', bromide: '', additive: '', amineApproved: '', amineDraft: '', bromideStudy: '' };

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'viewer'] });
  labId = lab.id;
  const second = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const emitter = await createCompound(lab.id, 'T-Ir-1', 'photocatalyst');
  const amine = await createCompound(lab.id, 'T-amine', 'quencher');
  const bromide = await createCompound(lab.id, 'T-ArBr', 'quencher');
  const additive = await createCompound(lab.id, 'T-additive', 'quencher');
  Object.assign(ids, { emitter: emitter.id, amine: amine.id, bromide: bromide.id, additive: additive.id });
  // Test inputs: an approved and a newer draft study of the same pair, and one of the bromide.
  ids.amineApproved = (
    await createStudyRecord({
      labId,
      emitterId: emitter.id,
      quencherId: amine.id,
      kq: 2e9,
      status: 'approved',
      title: 'amine, approved',
    })
  ).id;
  ids.amineDraft = (
    await createStudyRecord({
      labId,
      emitterId: emitter.id,
      quencherId: amine.id,
      kq: 5e9,
      status: 'draft',
      title: 'amine, draft',
    })
  ).id;
  ids.bromideStudy = (
    await createStudyRecord({ labId, emitterId: emitter.id, quencherId: bromide.id, kq: 1e8, status: 'submitted' })
  ).id;
  researcher = await apiClient(testApp.app);
  await researcher.signIn(users.researcher);
  other = await apiClient(testApp.app);
  await other.signIn(second.users.researcher);
});

const baseScenario = () => ({
  name: 'Coupling, standard conditions',
  emitterId: ids.emitter,
  solvent: 'acetonitrile',
  tau0: 1e-6,
  components: [
    { compoundId: ids.amine, concentration: 0.1 },
    { compoundId: ids.bromide, concentration: 0.05 },
    { kind: 'oxygen', concentration: 1.9e-3, manualKq: 2.4e9, manualKqSource: 'air-saturated MeCN (literature)' },
    { compoundId: ids.additive, concentration: 0.01 },
  ],
});

describe('POST /api/labs/:labId/scenarios', () => {
  it('when saved, then each component takes kq from the best study (approved first) and the shares match the engine', async () => {
    const response = await researcher.post(`/api/labs/${labId}/scenarios`, baseScenario());
    expect(response.status).toBe(201);
    const [amine, bromide, oxygen, additive] = response.body.shares;
    expect(amine.kq).toBe(2e9);
    expect(amine.kqSource).toMatchObject({ kind: 'study', studyId: ids.amineApproved, chosen: 'best-available' });
    expect(amine.candidates.map((c: { studyId: string }) => c.studyId)).toEqual([ids.amineApproved, ids.amineDraft]);
    expect(bromide.kq).toBe(1e8);
    expect(oxygen.kqSource).toEqual({ kind: 'manual', note: 'air-saturated MeCN (literature)' });
    // Hand check of shared/engine/README.md, section 8: rates kq c = 2e8, 5e6, 4.56e6 s^-1; 1/tau0 = 1e6 s^-1; total 2.1056e8 s^-1.
    expect(amine.fraction).toBeCloseTo(2e8 / 2.1056e8, 10);
    expect(response.body.unquenched).toBeCloseTo(1e6 / 2.1056e8, 12);
    // Cross-check against the engine on the same inputs.
    const engine = quenchingFractions({
      tau0: 1e-6,
      components: [
        { id: 'a', kq: 2e9, concentration: 0.1 },
        { id: 'b', kq: 1e8, concentration: 0.05 },
        { id: 'o', kq: 2.4e9, concentration: 1.9e-3 },
      ],
    });
    expect(bromide.fraction).toBeCloseTo(engine.components[1]!.fraction, 12);
    // The additive has no study: it is named as missing, not guessed.
    expect(additive.kq).toBeNull();
    expect(response.body.missing).toEqual([
      { componentId: additive.componentId, label: 'T-additive', compoundId: ids.additive },
    ]);
    expect(response.body.caution).toMatch(/not that the encounter leads to product/);
  });

  it("when a pair was also studied in another solvent, then the study in the reaction's solvent is preferred", async () => {
    await createStudyRecord({
      labId,
      emitterId: ids.emitter,
      quencherId: ids.bromide,
      kq: 9e9,
      status: 'approved',
      solventId: 'dmf',
      title: 'in DMF',
    });
    const response = await researcher.post(`/api/labs/${labId}/scenarios`, baseScenario());
    const bromide = response.body.shares[1];
    // kq depends on the solvent (viscosity, permittivity): an approved DMF result does not beat an acetonitrile one.
    expect(bromide.kqSource).toMatchObject({ studyId: ids.bromideStudy, solvent: 'acetonitrile' });
    expect(bromide.candidates.map((candidate: { solvent: string }) => candidate.solvent)).toEqual([
      'acetonitrile',
      'dmf',
    ]);
  });

  it('when a study is picked by hand, then its kq is used instead of the best available', async () => {
    const input = baseScenario();
    input.components[0] = { compoundId: ids.amine, concentration: 0.1, studyId: ids.amineDraft } as never;
    const response = await researcher.post(`/api/labs/${labId}/scenarios`, input);
    expect(response.body.shares[0]).toMatchObject({ kq: 5e9, kqSource: { studyId: ids.amineDraft, chosen: 'by-you' } });
  });

  it('when a concentration is negative or missing, then 400 names each component field', async () => {
    const input = baseScenario();
    input.components = [{ compoundId: ids.amine, concentration: -1 }, { compoundId: ids.bromide } as never];
    const response = await researcher.post(`/api/labs/${labId}/scenarios`, input);
    expect(response.status).toBe(400);
    expect(response.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'body.components.0.concentration',
      'body.components.1.concentration',
    ]);
  });

  it('when a study is unknown or of another pair, then 400 says which component and nothing is saved', async () => {
    const before = (await researcher.get(`/api/labs/${labId}/scenarios`)).body.total;
    const input = baseScenario();
    input.components[0] = {
      compoundId: ids.amine,
      concentration: 0.1,
      studyId: '00000000-0000-4000-8000-000000000000',
    } as never;
    input.components[1] = { compoundId: ids.bromide, concentration: 0.05, studyId: ids.amineApproved } as never;
    const response = await researcher.post(`/api/labs/${labId}/scenarios`, input);
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([
      { path: 'body.components.0.studyId', message: 'is not a study of this lab' },
      { path: 'body.components.1.studyId', message: 'studies a different emitter or quencher' },
    ]);
    expect((await researcher.get(`/api/labs/${labId}/scenarios`)).body.total).toBe(before);
  });
});

describe('PUT and DELETE /api/labs/:labId/scenarios/:scenarioId', () => {
  it('when edited with a stale version, then 409; with the current one, the change is kept', async () => {
    const created = (await researcher.post(`/api/labs/${labId}/scenarios`, baseScenario())).body;
    const changed = { ...baseScenario(), name: 'More amine', version: created.version };
    changed.components[0] = { compoundId: ids.amine, concentration: 0.5 } as never;
    const saved = await researcher.put(`/api/labs/${labId}/scenarios/${created.id}`, changed);
    expect(saved.status).toBe(200);
    expect(saved.body.shares[0].concentration).toBe(0.5);
    const stale = await researcher.put(`/api/labs/${labId}/scenarios/${created.id}`, {
      ...changed,
      version: created.version,
    });
    expect(stale.status).toBe(409);
    expect((await researcher.get(`/api/labs/${labId}/scenarios/${created.id}`)).body.name).toBe('More amine');
    expect((await researcher.delete(`/api/labs/${labId}/scenarios/${created.id}`)).status).toBe(204);
    expect((await researcher.get(`/api/labs/${labId}/scenarios/${created.id}`)).status).toBe(404);
  });

  it('when someone from another lab asks for a scenario, then 404', async () => {
    const created = (await researcher.post(`/api/labs/${labId}/scenarios`, baseScenario())).body;
    expect((await other.get(`/api/labs/${labId}/scenarios/${created.id}`)).status).toBe(404);
  });
});
