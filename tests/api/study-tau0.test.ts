import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Study } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { exactPoints, studyBody } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);
type Client = Awaited<ReturnType<typeof apiClient>>;
const tag = () => crypto.randomBytes(3).toString('hex');

let base = '';
let otherBase = '';
let researcher: Client;
let outsider: Client;
const ids = { emitter: '', otherEmitter: '', lifetime: '', otherEmitterLifetime: '', otherLabLifetime: '' };

async function lifetimeOf(
  client: Client,
  labBase: string,
  compoundId: string,
  value: number,
  uncertainty: number | null,
) {
  const response = await client.post(`${labBase}/compounds/${compoundId}/lifetimes`, {
    value,
    uncertainty,
    solvent: 'acetonitrile',
    atmosphere: 'argon',
    method: 'TCSPC',
  });
  expect(response.status).toBe(201);
  return response.body.id as string;
}

beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const other = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  base = `/api/labs/${lab.id}`;
  otherBase = `/api/labs/${other.lab.id}`;
  researcher = await apiClient(testApp.app);
  await researcher.signIn(users.researcher);
  outsider = await apiClient(testApp.app);
  await outsider.signIn(other.users.researcher);
  const compound = async (client: Client, labBase: string, name: string) =>
    (await client.post(`${labBase}/compounds`, { name, roleHint: 'photocatalyst' })).body.id as string;
  ids.emitter = await compound(researcher, base, `Tau-Ir-${tag()}`);
  ids.otherEmitter = await compound(researcher, base, `Tau-Ru-${tag()}`);
  ids.lifetime = await lifetimeOf(researcher, base, ids.emitter, 1.2e-6, 3e-8);
  ids.otherEmitterLifetime = await lifetimeOf(researcher, base, ids.otherEmitter, 5e-7, null);
  const foreign = await compound(outsider, otherBase, `Tau-Cu-${tag()}`);
  ids.otherLabLifetime = await lifetimeOf(outsider, otherBase, foreign, 9e-6, 1e-7);
});

const create = (extra: Record<string, unknown>) =>
  researcher.post(`${base}/studies`, {
    ...studyBody(tag(), { emitterId: ids.emitter, tau0: null, tau0Uncertainty: null }),
    newEmitterName: undefined,
    ...extra,
  });

describe('tau0 from a lifetime record: POST /api/labs/:labId/studies', () => {
  it('when only the record id is sent, then the server copies its value and uncertainty', async () => {
    const response = await create({ tau0LifetimeId: ids.lifetime });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ tau0: 1.2e-6, tau0Uncertainty: 3e-8, tau0LifetimeId: ids.lifetime });
  });

  it('when a different tau0 is sent under the record id, then 400 names tau0 and nothing is stored', async () => {
    const response = await create({ tau0LifetimeId: ids.lifetime, tau0: 2e-6 });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual(
      expect.arrayContaining([expect.objectContaining({ path: 'body.tau0' })]),
    );
  });

  it("when another lab's or an unknown lifetime id is sent, then 404; another emitter's, then 400", async () => {
    expect((await create({ tau0LifetimeId: ids.otherLabLifetime })).status).toBe(404);
    expect((await create({ tau0LifetimeId: crypto.randomUUID() })).status).toBe(404);
    const wrongEmitter = await create({ tau0LifetimeId: ids.otherEmitterLifetime });
    expect(wrongEmitter.status).toBe(400);
    expect(wrongEmitter.body.error.details[0].path).toBe('body.tau0LifetimeId');
  });
});

describe('tau0 from a lifetime record: PATCH /api/labs/:labId/studies/:studyId', () => {
  it("when a PATCH sends another lab's lifetime id with a tau0, then 404 and the study keeps its tau0", async () => {
    const study = (await create({ tau0: 1e-6, tau0Uncertainty: null })).body;
    const response = await researcher.patch(`${base}/studies/${study.id}`, {
      version: study.version,
      tau0: 9e-6,
      tau0LifetimeId: ids.otherLabLifetime,
    });
    expect(response.status).toBe(404);
    const after = (await researcher.get(`${base}/studies/${study.id}`)).body;
    expect(after).toMatchObject({ tau0: 1e-6, tau0LifetimeId: null });
  });

  it('when a PATCH sends an unknown lifetime id, then 404 (not 500)', async () => {
    const study = (await create({ tau0: 1e-6 })).body;
    const response = await researcher.patch(`${base}/studies/${study.id}`, {
      version: study.version,
      tau0: 1e-6,
      tau0LifetimeId: crypto.randomUUID(),
    });
    expect(response.status).toBe(404);
  });

  it("when a PATCH links another emitter's record, or changes the emitter under a linked record, then 400", async () => {
    const study = (await create({ tau0LifetimeId: ids.lifetime })).body;
    const wrong = await researcher.patch(`${base}/studies/${study.id}`, {
      version: study.version,
      tau0LifetimeId: ids.otherEmitterLifetime,
    });
    expect(wrong.status).toBe(400);
    const moved = await researcher.patch(`${base}/studies/${study.id}`, {
      version: study.version,
      emitterId: ids.otherEmitter,
    });
    expect(moved.status).toBe(400);
    expect(moved.body.error.details[0].path).toBe('body.tau0LifetimeId');
  });

  it('when a PATCH types a tau0, then it is stored as entered (the record link is dropped) and the fit says so', async () => {
    const study = (await create({ tau0LifetimeId: ids.lifetime })).body;
    const withPoints = (
      await researcher
        .patch(`${base}/studies/${study.id}/points`, { version: study.version, points: exactPoints })
        .expect(200)
    ).body;
    expect(withPoints.latestFit.result.tau0).toMatchObject({
      value: 1.2e-6,
      standardError: 3e-8,
      kind: 'lifetime-record',
    });
    const typed = await researcher.patch(`${base}/studies/${study.id}`, {
      version: withPoints.version,
      tau0: 1.5e-6,
      tau0Uncertainty: 5e-8,
    });
    expect(typed.status).toBe(200);
    expect(typed.body).toMatchObject({ tau0: 1.5e-6, tau0Uncertainty: 5e-8, tau0LifetimeId: null });
    expect(typed.body.latestFit.result.tau0).toMatchObject({ value: 1.5e-6, standardError: 5e-8, kind: 'entered' });
  });

  it('when a PATCH sends only the record id, then the server copies the record (the library refit path)', async () => {
    const study = (await create({ tau0: 1e-6 })).body;
    const linked = await researcher.patch(`${base}/studies/${study.id}`, {
      version: study.version,
      tau0LifetimeId: ids.lifetime,
    });
    expect(linked.status).toBe(200);
    expect(linked.body).toMatchObject({ tau0: 1.2e-6, tau0Uncertainty: 3e-8, tau0LifetimeId: ids.lifetime });
  });
});

describe('tau0 at fit time', () => {
  it('when a linked study holds another number than its record (an older client copy), then the fit takes the record’s value and SE', async () => {
    const study = (await create({ tau0LifetimeId: ids.lifetime })).body;
    // A copy written before the server resolved the record: value and SE that are not the record's.
    await Study.update({ tau0: 9.9e-6, tau0Uncertainty: null }, { where: { id: study.id } });
    const fitted = await researcher
      .patch(`${base}/studies/${study.id}/points`, { version: study.version, points: exactPoints })
      .expect(200);
    expect(fitted.body.latestFit.result.tau0).toMatchObject({
      value: 1.2e-6,
      standardError: 3e-8,
      kind: 'lifetime-record',
    });
  });
});
