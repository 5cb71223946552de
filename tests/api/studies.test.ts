import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createStudy, exactPoints, studyBody } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
type Client = Awaited<ReturnType<typeof apiClient>>;
let labId = '';
const clients = {} as Record<'researcher' | 'other' | 'reviewer' | 'viewer', Client>;
let reviewerEmail = '';
let researcherEmail = '';
const tag = () => crypto.randomBytes(3).toString('hex');

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'reviewer', 'viewer'] });
  const second = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  labId = lab.id;
  const { Membership } = await import('../../server/models');
  await Membership.create({ labId, userId: second.users.researcher.id, role: 'researcher' });
  for (const [name, user] of [
    ['researcher', users.researcher],
    ['reviewer', users.reviewer],
    ['viewer', users.viewer],
    ['other', second.users.researcher],
  ] as const) {
    clients[name] = await apiClient(testApp.app);
    await clients[name].signIn(user);
  }
  reviewerEmail = users.reviewer.email;
  researcherEmail = users.researcher.email;
});
afterAll(testApp.close);

const url = (studyId = '') => `/api/labs/${labId}/studies${studyId ? `/${studyId}` : ''}`;

describe('POST /api/labs/:labId/studies', () => {
  it('when a researcher names new compounds, then a draft study is created with them in the library', async () => {
    const t = tag();
    const response = await clients.researcher.post(url(), studyBody(t));
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      status: 'draft',
      revision: 1,
      version: 0,
      emitter: { name: `TEST-Ir-${t}` },
      solventLabel: 'acetonitrile',
      temperature: 298.15,
    });
    const options = await clients.viewer.get(`/api/labs/${labId}/study-form-options`);
    expect(options.body.compounds).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: `TEST-Ir-${t}`, roleHint: 'photocatalyst' })]),
    );
  });
  it('when fields are missing or inconsistent, then 400 names each field', async () => {
    const response = await clients.researcher.post(url(), {
      title: '',
      solventId: null,
      atmosphere: 'argon',
      degassingMethod: 'none',
      dilutionCorrection: true,
    });
    expect(response.status).toBe(400);
    const paths = response.body.error.details.map((detail: { path: string }) => detail.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        'body.title',
        'body.solventId',
        'body.initialVolume',
        'body.emitterId',
        'body.quencherId',
      ]),
    );
  });
  it('when a viewer tries, then 403', async () => {
    expect((await clients.viewer.post(url(), studyBody(tag()))).status).toBe(403);
  });
});

describe('PATCH /api/labs/:labId/studies/:studyId/points', () => {
  it('when points are saved, then the engine fits them: K_SV 500 M^-1, kq 5e8 M^-1 s^-1 (exact line by construction)', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    const response = await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints });
    expect(response.status).toBe(200);
    expect(response.body.fitProblem).toBeNull();
    expect(response.body.version).toBe(1);
    expect(response.body.latestFit.kSv).toBeCloseTo(500, 6);
    expect(response.body.latestFit.kq).toBeCloseTo(5e8, -1);
    expect(response.body.latestFit.engineVersion).toBe('1.5.0');
    const fits = await clients.viewer.get(`${url(study.id)}/fits`);
    expect(fits.body.items).toHaveLength(1);
  });
  it('when the version is stale, then 409 stale_version and the points stay', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const stale = await clients.researcher.patch(`${url(study.id)}/points`, {
      version: 0,
      points: exactPoints.slice(0, 3),
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect((await clients.viewer.get(url(study.id))).body.points).toHaveLength(6);
  });
  it('when a concentration is negative, then 400 names the point and field', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    const points = exactPoints.map((p, i) => (i === 3 ? { ...p, concentration: -1e-3 } : p));
    const response = await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points });
    expect(response.status).toBe(400);
    expect(response.body.error.details[0].path).toBe('body.points.3.concentration');
  });
  it('when someone else in the lab tries to change the study, then 403 not_owner', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    const response = await clients.other.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('not_owner');
  });
});

describe('POST /api/labs/:labId/studies/:studyId/fits', () => {
  it('when the owner asks for the fixed-intercept model, then a second fit is stored and the first kept', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const response = await clients.researcher.post(`${url(study.id)}/fits`, { model: 'linear-fixed' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ model: 'linear-fixed', trigger: 'manual' });
    const fits = await clients.viewer.get(`${url(study.id)}/fits`);
    expect(fits.body.items.map((fit: { model: string }) => fit.model)).toEqual(['linear-fixed', 'linear-free']);
  });
});

describe('review: submit, return, approve, revision', () => {
  it('when the owner submits and a reviewer approves, then mails go out, the study locks, and a revision keeps the approved one', async () => {
    const t = tag();
    const study = await createStudy(clients.researcher, labId, t);
    await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const submitted = await clients.researcher.post(`${url(study.id)}/submit`, {});
    expect(submitted.body.status).toBe('submitted');
    expect((await latestMailTo(reviewerEmail)).mail?.subject).toBe(`Study ready for review: Test study ${t}`);
    expect((await clients.researcher.post(`${url(study.id)}/approve`, {})).status).toBe(403);
    const returned = await clients.reviewer.post(`${url(study.id)}/return`, { comment: 'Add a replicate blank' });
    expect(returned.body.status).toBe('returned');
    expect((await latestMailTo(researcherEmail)).mail?.textBody).toContain('Add a replicate blank');
    await clients.researcher.post(`${url(study.id)}/submit`, {}).expect(200);
    const approved = await clients.reviewer.post(`${url(study.id)}/approve`, { comment: 'Fine' });
    expect(approved.body.status).toBe('approved');
    expect(approved.body.reviews.map((r: { action: string }) => r.action)).toEqual([
      'submit',
      'return',
      'submit',
      'approve',
    ]);
    const locked = await clients.researcher.patch(`${url(study.id)}/points`, {
      version: approved.body.version,
      points: exactPoints,
    });
    expect(locked.body.error.code).toBe('study_locked');
    const revision = await clients.researcher.post(`${url(study.id)}/revisions`, {});
    expect(revision.status).toBe(201);
    expect(revision.body).toMatchObject({ revision: 2, status: 'draft', previousRevisionId: study.id });
    expect(revision.body.points).toHaveLength(6);
    expect((await clients.viewer.get(url(study.id))).body).toMatchObject({
      status: 'approved',
      nextRevisionId: revision.body.id,
    });
    const history = await clients.viewer.get(`${url(study.id)}/history`);
    expect(history.body.events.map((e: { action: string }) => e.action)).toEqual(
      expect.arrayContaining(['study_created', 'study_points_replaced', 'study_approved']),
    );
  });
  it('when a return has no comment, then 400', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    expect((await clients.reviewer.post(`${url(study.id)}/return`, {})).status).toBe(400);
  });
});

describe('GET /api/labs/:labId/studies', () => {
  it('when filtering by status, flag, quencher and text, and sorting by kq, then only matching studies come back with the total', async () => {
    const t = tag();
    const slow = await createStudy(clients.researcher, labId, `${t}a`, { notes: `unique-${t}` });
    await clients.researcher.patch(`${url(slow.id)}/points`, { version: 0, points: exactPoints }).expect(200);
    const fast = await createStudy(clients.researcher, labId, `${t}b`, { notes: `unique-${t}` });
    const fastPoints = exactPoints.map((p) => ({ ...p, intensity: 1000 / (1 + 40000 * p.concentration) }));
    await clients.researcher.patch(`${url(fast.id)}/points`, { version: 0, points: fastPoints }).expect(200);
    const search = await clients.viewer.get(`${url()}?q=unique-${t}&sort=kq&direction=desc`);
    expect(search.body.total).toBe(2);
    expect(search.body.items.map((s: { id: string }) => s.id)).toEqual([fast.id, slow.id]);
    const flagged = await clients.viewer.get(`${url()}?q=unique-${t}&flagged=true`);
    expect(flagged.body.items.map((s: { id: string }) => s.id)).toEqual([fast.id]);
    const byQuencher = await clients.viewer.get(`${url()}?quencherId=${slow.quencher.id}&status=draft`);
    expect(byQuencher.body.items.map((s: { id: string }) => s.id)).toEqual([slow.id]);
  });
});

describe('GET /api/labs/:labId/studies/:studyId/export.csv', () => {
  it('when a text cell starts with =, then it is neutralised while negative numbers stay numbers', async () => {
    const study = await createStudy(clients.researcher, labId, tag());
    const points = exactPoints.map((p, i) =>
      i === 5 ? { ...p, excluded: true, exclusionReason: '=HYPERLINK("x")' } : p,
    );
    await clients.researcher.patch(`${url(study.id)}/points`, { version: 0, points }).expect(200);
    const csv = await clients.viewer.get(`${url(study.id)}/export.csv?part=points`);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text).toContain(`"'=HYPERLINK(""x"")"`);
    const fitCsv = await clients.viewer.get(`${url(study.id)}/export.csv?part=fit`);
    expect(fitCsv.text).toMatch(/^kSv,500(\.0+\d*)?,/m);
  });
});
