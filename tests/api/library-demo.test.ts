import { afterAll, describe, expect, it } from 'vitest';
import { demoEmitterNames, demoQuencherNames, seedDemoLibrary } from '../../server/seed/demo-library';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

describe('seedDemoLibrary', () => {
  it('when the demo library is loaded, then every emitter–quencher pair shows a driving force', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const { compounds: ids } = await testApp.sequelize.transaction((transaction) =>
      seedDemoLibrary(transaction, { marram: lab }),
    );
    const viewer = await apiClient(testApp.app);
    await viewer.signIn(users.viewer);
    const references = new Set<string>();
    for (const emitter of demoEmitterNames) {
      const detail = (await viewer.get(`/api/labs/${lab.id}/compounds/${ids[emitter]}`)).body;
      for (const potential of detail.potentials) references.add(potential.reference);
      expect(detail.lifetimes.length, emitter).toBeGreaterThan(0);
      for (const quencher of demoQuencherNames) {
        const force = await viewer.get(
          `/api/labs/${lab.id}/driving-force?emitterId=${ids[emitter]}&quencherId=${ids[quencher]}&solvent=acetonitrile`,
        );
        expect(force.status).toBe(200);
        expect(force.body.oxidative ?? force.body.reductive, `${emitter} + ${quencher}`).not.toBeNull();
      }
    }
    expect(references.size).toBeGreaterThanOrEqual(2);
  });
});
