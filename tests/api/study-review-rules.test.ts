import { afterAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

describe('POST /api/labs/:labId/studies/:studyId/approve', () => {
  it('when a reviewer tries to approve their own study, then 403 own_study and it stays submitted; another reviewer can', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['reviewer', 'admin'] });
    const emitter = await createCompound(lab.id, 'R-cat', 'photocatalyst');
    const quencher = await createCompound(lab.id, 'R-q', 'quencher');
    const study = await createStudyRecord({
      labId: lab.id,
      emitterId: emitter.id,
      quencherId: quencher.id,
      ownerId: users.reviewer.id,
      status: 'submitted',
      kq: 1e9,
    });
    const owner = await apiClient(testApp.app);
    await owner.signIn(users.reviewer);
    const own = await owner.post(`/api/labs/${lab.id}/studies/${study.id}/approve`, { comment: 'looks fine to me' });
    expect(own.status).toBe(403);
    expect(own.body.error.code).toBe('own_study');
    expect((await owner.get(`/api/labs/${lab.id}/studies/${study.id}`)).body.status).toBe('submitted');

    const other = await apiClient(testApp.app);
    await other.signIn(users.admin);
    expect((await other.post(`/api/labs/${lab.id}/studies/${study.id}/approve`, { comment: '' })).status).toBe(200);
    expect((await other.get(`/api/labs/${lab.id}/studies/${study.id}`)).body.status).toBe('approved');
  });
});
