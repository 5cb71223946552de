import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

/** A study row as the studies feature stores it, written directly so this test needs only the table. */
async function insertStudy(labId: string, emitterId: string, quencherId: string, lifetimeId: string, tau0: number) {
  const id = crypto.randomUUID();
  await testApp.sequelize.query(
    `INSERT INTO studies (id, lab_id, emitter_id, quencher_id, title, atmosphere, degassing_method, tau0, tau0_lifetime_id, created_at, updated_at)
     VALUES (:id, :labId, :emitterId, :quencherId, :title, 'argon', 'sparging', :tau0, :lifetimeId, now(), now())`,
    { replacements: { id, labId, emitterId, quencherId, lifetimeId, tau0, title: `Study ${id.slice(0, 6)}` } },
  );
  return id;
}

describe('GET /api/labs/:labId/compounds/:compoundId/lifetimes/:lifetimeId/dependents', () => {
  it('when a lifetime record used as tau0 changes, then its studies are listed and marked as no longer matching', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    const post = (url: string, body: object) => researcher.post(`/api/labs/${lab.id}${url}`, body);
    const emitter = (await post('/compounds', { name: 'Dep-Ir', roleHint: 'photocatalyst' })).body;
    const quencher = (await post('/compounds', { name: 'Dep-Q', roleHint: 'quencher' })).body;
    const lifetime = (
      await post(`/compounds/${emitter.id}/lifetimes`, {
        value: 1.1e-6,
        solvent: 'acetonitrile',
        atmosphere: 'argon',
        method: 'TCSPC',
      })
    ).body;
    const studyId = await insertStudy(lab.id, emitter.id, quencher.id, lifetime.id, 1.1e-6);
    const url = `/api/labs/${lab.id}/compounds/${emitter.id}/lifetimes/${lifetime.id}`;

    const before = await researcher.get(`${url}/dependents`);
    expect(before.status).toBe(200);
    expect(before.body.studies).toEqual([expect.objectContaining({ studyId, tau0: 1.1e-6, matchesRecord: true })]);

    await researcher.patch(url, { value: 9.3e-7, version: lifetime.version });
    const after = await researcher.get(`${url}/dependents`);
    expect(after.body.value).toBe(9.3e-7);
    // The study keeps its own tau0 until someone chooses to refit it.
    expect(after.body.studies).toEqual([expect.objectContaining({ studyId, tau0: 1.1e-6, matchesRecord: false })]);
  });

  it('when a study uses a compound, then removing the compound is refused with 409 and it stays', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['reviewer'] });
    const reviewer = await apiClient(testApp.app);
    await reviewer.signIn(users.reviewer);
    const post = (url: string, body: object) => reviewer.post(`/api/labs/${lab.id}${url}`, body);
    const emitter = (await post('/compounds', { name: 'Used-Ir', roleHint: 'photocatalyst' })).body;
    const quencher = (await post('/compounds', { name: 'Used-Q', roleHint: 'quencher' })).body;
    const lifetime = (
      await post(`/compounds/${emitter.id}/lifetimes`, {
        value: 2e-6,
        solvent: 'acetonitrile',
        atmosphere: 'argon',
        method: 'TCSPC',
      })
    ).body;
    await insertStudy(lab.id, emitter.id, quencher.id, lifetime.id, 2e-6);
    const refused = await reviewer.delete(`/api/labs/${lab.id}/compounds/${quencher.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('compound_in_use');
    expect((await reviewer.get(`/api/labs/${lab.id}/compounds/${quencher.id}`)).status).toBe(200);
  });
});
