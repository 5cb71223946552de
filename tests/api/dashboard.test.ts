import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Study } from '../../server/models';
import { recordAudit } from '../../server/services/audit.service';
import { apiClient, createLabWithMembers } from '../support/accounts';
import type { TestUser } from '../support/accounts';
import { createCompound, createStudyRecord } from '../support/study-records';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let labId = '';
let users: Record<'researcher' | 'reviewer' | 'viewer', TestUser>;
const studyIds = { submitted: '', returned: '', flagged: '' };

beforeAll(async () => {
  const setup = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'reviewer', 'viewer'] });
  labId = setup.lab.id;
  users = setup.users;
  const emitter = await createCompound(labId, 'D-cat', 'photocatalyst');
  const quencher = await createCompound(labId, 'D-q', 'quencher');
  const base = { labId, emitterId: emitter.id, quencherId: quencher.id, ownerId: users.researcher.id };
  studyIds.submitted = (await createStudyRecord({ ...base, status: 'submitted', title: 'waiting', kq: 1e9 })).id;
  studyIds.returned = (await createStudyRecord({ ...base, status: 'returned', title: 'came back' })).id;
  const flagged = await createStudyRecord({ ...base, title: 'too fast', kq: 5e10 });
  await Study.update({ flagged: true }, { where: { id: flagged.id } });
  studyIds.flagged = flagged.id;
  // An automatic refit (noise on a dashboard) before the return that should show.
  await recordAudit(
    { userId: users.researcher.id, ip: null },
    { action: 'study_fitted', labId, targetType: 'study', targetId: studyIds.flagged, details: { trigger: 'auto' } },
  );
  await recordAudit(
    { userId: users.researcher.id, ip: null },
    { action: 'study_fitted', labId, targetType: 'study', targetId: studyIds.flagged, details: { trigger: 'manual' } },
  );
  await recordAudit(
    { userId: users.reviewer.id, ip: null },
    { action: 'study_returned', labId, targetType: 'study', targetId: studyIds.returned },
  );
});

describe('GET /api/labs/:labId/dashboard', () => {
  it('when a reviewer opens it, then submitted studies wait for review and the activity reads in plain words', async () => {
    const client = await apiClient(testApp.app);
    await client.signIn(users.reviewer);
    const response = await client.get(`/api/labs/${labId}/dashboard`);
    expect(response.status).toBe(200);
    expect(response.body.waitingForMyReview.map((study: { id: string }) => study.id)).toEqual([studyIds.submitted]);
    expect(response.body.myReturned).toEqual([]);
    expect(response.body.myDrafts).toEqual([]);
    expect(response.body.recentlyFlagged.map((study: { id: string }) => study.id)).toEqual([studyIds.flagged]);
    expect(response.body.recentActivity[0]).toMatchObject({
      description: 'returned a study with comments “came back”',
      actor: users.reviewer.name,
      targetId: studyIds.returned,
    });
  });

  it('when the owner opens it, then their returned study is listed and nothing waits for their review', async () => {
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const response = await client.get(`/api/labs/${labId}/dashboard`);
    expect(response.body.myReturned.map((study: { title: string }) => study.title)).toEqual(['came back']);
    expect(response.body.waitingForMyReview).toEqual([]);
    // createStudyRecord makes drafts unless told otherwise: 'too fast' is the owner's only draft.
    expect(response.body.myDrafts.map((study: { title: string }) => study.title)).toEqual(['too fast']);
  });

  it('when a viewer opens it, then sign-ins and automatic refits are left out of the activity', async () => {
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const response = await client.get(`/api/labs/${labId}/dashboard`);
    expect(response.body.recentActivity.map((event: { description: string }) => event.description)).toEqual([
      'returned a study with comments “came back”',
      'fitted a study “too fast”',
    ]);
  });
});
