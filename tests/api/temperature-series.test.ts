import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GAS_CONSTANT, solventDiffusionLimit } from '../../shared/engine';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let labId = '';
let viewer: Awaited<ReturnType<typeof apiClient>>;
const dynamic: string[] = [];
const staticIds: string[] = [];
let otherSolvent = '';
let otherLabStudy = '';

const temperatures = [283.15, 298.15, 313.15, 328.15];
// Test inputs (invented): kq half the diffusion limit at each temperature (dynamic), and a
// complex whose K falls with dH = -25 kJ/mol (static); tau0 = 1 us in both.
const dynamicKq = (t: number) => 0.5 * solventDiffusionLimit('acetonitrile', t);
const staticK = (t: number) => 300 * Math.exp((25_000 / GAS_CONSTANT) * (1 / t - 1 / 298.15));

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
  labId = lab.id;
  viewer = await apiClient(testApp.app);
  await viewer.signIn(users.viewer!);
  const emitter = await createCompound(lab.id, 'T-emitter', 'photocatalyst');
  const amine = await createCompound(lab.id, 'T-amine', 'quencher');
  const iodide = await createCompound(lab.id, 'T-iodide', 'quencher');
  for (const [i, temperature] of temperatures.entries()) {
    const a = await createStudyRecord({
      labId,
      emitterId: emitter.id,
      quencherId: amine.id,
      kq: dynamicKq(temperature),
      temperature,
      title: `amine ${i}`,
    });
    dynamic.push(a.id);
    const b = await createStudyRecord({
      labId,
      emitterId: emitter.id,
      quencherId: iodide.id,
      kSv: staticK(temperature),
      kq: staticK(temperature) / 1e-6,
      temperature,
      title: `iodide ${i}`,
    });
    staticIds.push(b.id);
  }
  otherSolvent = (
    await createStudyRecord({
      labId,
      emitterId: emitter.id,
      quencherId: amine.id,
      kq: 5e9,
      temperature: 303.15,
      solventId: 'dmf',
      title: 'amine in DMF',
    })
  ).id;
  const second = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const foreignEmitter = await createCompound(second.lab.id, 'X', 'photocatalyst');
  otherLabStudy = (
    await createStudyRecord({
      labId: second.lab.id,
      emitterId: foreignEmitter.id,
      quencherId: foreignEmitter.id,
      kq: 1e9,
    })
  ).id;
});

const analysis = (ids: string[]) =>
  viewer.get(`/api/labs/${labId}/temperature-series/analysis?studies=${ids.join(',')}`);

describe('GET /api/labs/:labId/temperature-series', () => {
  it('when a pair was measured at several temperatures in one solvent, then it is listed as a series', async () => {
    const response = await viewer.get(`/api/labs/${labId}/temperature-series`);
    expect(response.status).toBe(200);
    const amine = response.body.items.find(
      (item: { quencher: { name: string }; solvent: string }) =>
        item.quencher.name === 'T-amine' && item.solvent === 'acetonitrile',
    );
    expect(amine).toMatchObject({ ready: true, temperatures, studyIds: dynamic });
    // the single DMF study is no series
    expect(response.body.items.some((item: { solvent: string }) => item.solvent === 'dmf')).toBe(false);
  });
});

describe('GET /api/labs/:labId/temperature-series/analysis', () => {
  it('when kq follows the diffusion limit, then the verdict is dynamic with Ea beside the viscous-flow energy', async () => {
    const response = await analysis(dynamic);
    expect(response.status).toBe(200);
    expect(response.body.verdict).toBe('dynamic');
    expect(response.body.points).toHaveLength(4);
    // kq ∝ T/eta with Perry's ln eta = C1 + C2/T for MeCN: Ea = R (872.02 + T) exactly for the
    // continuous function; over 283–328 K the line through the points gives R(872.02 + ~304)
    const ea = response.body.arrhenius.activationEnergy.value;
    expect(Math.abs(ea - GAS_CONSTANT * (872.02 + 304.5)) / ea).toBeLessThan(0.01);
    expect(response.body.viscousFlowActivationEnergy).toBeCloseTo(GAS_CONSTANT * 872.02, 3);
    expect(response.body.eyring.activationEnthalpy.value).toBeLessThan(ea);
  });

  it('when K_SV falls with temperature, then the verdict is static', async () => {
    const response = await analysis(staticIds);
    expect(response.status).toBe(200);
    expect(response.body.verdict).toBe('static');
    expect(response.body.reasons.join(' ')).toMatch(/falls as the temperature rises/);
  });

  it('when only two temperatures are chosen, then 400 names the count', async () => {
    const response = await analysis(dynamic.slice(0, 2));
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('series_too_few_temperatures');
    expect(response.body.error.message).toMatch(/at least 3 different temperatures; these studies span 2/);
  });

  it('when the studies are in two solvents, then 400 names both', async () => {
    const response = await analysis([...dynamic, otherSolvent]);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('series_mixed_solvents');
    expect(response.body.error.message).toMatch(/acetonitrile/);
    expect(response.body.error.message).toMatch(/N,N-dimethylformamide/);
  });

  it('when the studies are of two quenchers, then 400 names the pairs', async () => {
    const response = await analysis([...dynamic.slice(0, 2), staticIds[2]!]);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('series_mixed_pairs');
  });

  it('when a study belongs to another lab, then 404 names it', async () => {
    const response = await analysis([...dynamic, otherLabStudy]);
    expect(response.status).toBe(404);
    expect(response.body.error.message).toContain(otherLabStudy);
  });

  it('when the query is not a list of ids, then 400 names the field', async () => {
    const response = await viewer.get(`/api/labs/${labId}/temperature-series/analysis?studies=abc`);
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body.error)).toMatch(/studies/);
  });
});
