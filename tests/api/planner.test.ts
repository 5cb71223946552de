import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);
let client: Awaited<ReturnType<typeof apiClient>>;
let labId = '';

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
  labId = lab.id;
  client = await apiClient(testApp.app);
  await client.signIn(users.viewer);
});

describe('POST /api/labs/:labId/titration-plans', () => {
  it('when targets are given, then each addition reproduces the target by the mass balance', async () => {
    const response = await client.post(`/api/labs/${labId}/titration-plans`, {
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.1,
      targets: [1e-3, 2e-3],
    });
    expect(response.status).toBe(200);
    // Mass balance (shared/engine/README.md, section 9): c_stock V / (V0 + V) = target, so V = target V0 / (c_stock - target):
    // 1 mM from 0.1 M into 2 mL: 1e-3 * 2e-3 / 0.099 = 2.0202e-5 L = 20.202 µL; 2 mM: 40.816 µL in all.
    const [first, second] = response.body.steps;
    expect(first.additionMicrolitres).toBeCloseTo(20.20202, 4);
    expect(second.cumulativeAddedMicrolitres).toBeCloseTo(40.81633, 4);
    expect(second.additionMicrolitres).toBeCloseTo(40.81633 - 20.20202, 4);
    expect(second.concentration).toBeCloseTo(2e-3, 12);
    // Emitter diluted from 10 µM by V0 / (V0 + V): 10 * 2 / 2.0408163 = 9.8 µM.
    expect(second.emitterConcentration).toBeCloseTo(9.8e-6, 12);
    expect(response.body.flags).toEqual([]);
  });

  it('when the plan dilutes the emitter by more than about 10 %, then it says so and how to avoid it', async () => {
    const response = await client.post(`/api/labs/${labId}/titration-plans`, {
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.05,
      maximum: 0.01,
      count: 5,
    });
    expect(response.body.steps).toHaveLength(5);
    // 10 mM from a 50 mM stock needs V = 0.01 * 2 / 0.04 = 0.5 mL: 0.5 / 2.5 = 20 % dilution.
    expect(response.body.totalDilution).toBeCloseTo(0.2, 12);
    expect(response.body.flags.map((flag: { code: string }) => flag.code)).toEqual(['LARGE_DILUTION']);
  });

  it('when a target cannot be reached with the stock, then 400 names the target and the remedy', async () => {
    const response = await client.post(`/api/labs/${labId}/titration-plans`, {
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.01,
      targets: [0.005, 0.02],
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('engine_target_unreachable');
    expect(response.body.error.details[0].path).toBe('targets[1]');
    expect(response.body.error.message).toMatch(/more concentrated stock/);
  });

  it('when neither targets nor a maximum with a count are given, then 400 explains what is needed', async () => {
    const response = await client.post(`/api/labs/${labId}/titration-plans`, {
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.1,
    });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([
      {
        path: 'body.targets',
        message: 'give target concentrations, or a highest concentration and a number of points',
      },
    ]);
  });
});

describe('POST /api/labs/:labId/titration-plans/csv', () => {
  it('when exported, then the CSV has the plan in bench units and neutralises formula-like text', async () => {
    const response = await client.post(`/api/labs/${labId}/titration-plans/csv`, {
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.1,
      targets: [1e-3],
      quencherName: '=HYPERLINK("x")',
    });
    expect(response.headers['content-type']).toMatch(/text\/csv/);
    const lines = response.text.trim().split('\n');
    expect(lines).toContain(`# quencher,"'=HYPERLINK(""x"")"`);
    // Emitter: 10 µM x V0 / (V0 + V) = 10 x (c_stock - target) / c_stock = 10 x 0.099 / 0.1 = 9.9 µM.
    expect(lines.at(-1)).toBe('1,1,20.202,20.202,2020.2,1,9.9');
  });
});
