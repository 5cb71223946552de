import { afterAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

async function labWithLifetime() {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'reviewer'] });
  const researcher = await apiClient(testApp.app);
  await researcher.signIn(users.researcher);
  const reviewer = await apiClient(testApp.app);
  await reviewer.signIn(users.reviewer);
  const base = `/api/labs/${lab.id}`;
  const emitter = (await researcher.post(`${base}/compounds`, { name: 'Refit-Ir', roleHint: 'photocatalyst' })).body;
  const lifetime = (
    await researcher.post(`${base}/compounds/${emitter.id}/lifetimes`, {
      value: 1e-6,
      uncertainty: 2e-8,
      solvent: 'acetonitrile',
      atmosphere: 'argon',
      method: 'TCSPC',
    })
  ).body;
  const lifetimeUrl = `${base}/compounds/${emitter.id}/lifetimes/${lifetime.id}`;
  /** A study whose tau0 the studies API copies from the lifetime record, with the exact demo series. */
  const study = async (title: string) => {
    const created = await researcher.post(`${base}/studies`, {
      title,
      emitterId: emitter.id,
      newQuencherName: `Q ${title}`,
      solventId: 'acetonitrile',
      atmosphere: 'argon',
      degassingMethod: 'sparging',
      tau0LifetimeId: lifetime.id,
      fitModel: 'linear-fixed',
    });
    expect(created.status).toBe(201);
    return (
      await researcher
        .patch(`${base}/studies/${created.body.id}/points`, { version: created.body.version, points: exactPoints })
        .expect(200)
    ).body;
  };
  return { base, researcher, reviewer, userId: users.researcher.id, lifetime, lifetimeUrl, study };
}

describe('refitting the studies that take tau0 from a changed lifetime', () => {
  it('when the record changes, then the listed study refits through PATCH tau0 and POST fits with its own model', async () => {
    const { base, researcher, userId, lifetime, lifetimeUrl, study } = await labWithLifetime();
    const draft = await study('Refit draft');
    expect(draft.tau0).toBe(1e-6);

    await researcher.patch(lifetimeUrl, { value: 8e-7, uncertainty: 3e-8, version: lifetime.version }).expect(200);
    const listed = (await researcher.get(`${lifetimeUrl}/dependents`)).body;
    expect(listed).toMatchObject({ value: 8e-7, uncertainty: 3e-8 });
    const [entry] = listed.studies;
    expect(entry).toMatchObject({
      studyId: draft.id,
      status: 'draft',
      tau0: 1e-6,
      tau0Uncertainty: 2e-8,
      matchesRecord: false,
      fitModel: 'linear-fixed',
      version: draft.version,
      ownerId: userId,
    });

    // What the compound screen's "Refit" does, in this order.
    const patched = await researcher.patch(`${base}/studies/${draft.id}`, {
      tau0LifetimeId: listed.lifetimeId,
      version: entry.version,
    });
    expect(patched.status).toBe(200);
    const fit = await researcher.post(`${base}/studies/${draft.id}/fits`, { model: entry.fitModel });
    expect(fit.status).toBe(201);
    expect(fit.body).toMatchObject({ model: 'linear-fixed', trigger: 'manual' });
    expect(fit.body.result.tau0.value).toBe(8e-7);
    // I0/I = 1 + 500 [Q] exactly (tests/support/studies.ts), so kq = K_SV / tau0 = 500 / 8e-7 = 6.25e8 M^-1 s^-1 (Stern–Volmer, kq = K_SV/tau0).
    expect(fit.body.kq).toBeCloseTo(6.25e8, -3);

    const after = (await researcher.get(`${lifetimeUrl}/dependents`)).body.studies[0];
    expect(after).toMatchObject({ tau0: 8e-7, tau0Uncertainty: 3e-8, matchesRecord: true });
    expect((await researcher.get(`${base}/studies/${draft.id}`)).body.latestFit.id).toBe(fit.body.id);
  });

  it('when a listed study is approved or the version read is old, then the studies API refuses and the study keeps its tau0', async () => {
    const { base, researcher, reviewer, lifetime, lifetimeUrl, study } = await labWithLifetime();
    const approvedOne = await study('Refit approved');
    await researcher.post(`${base}/studies/${approvedOne.id}/submit`, {}).expect(200);
    await reviewer.post(`${base}/studies/${approvedOne.id}/approve`, { comment: 'Fine' }).expect(200);
    await researcher.patch(lifetimeUrl, { value: 9e-7, version: lifetime.version }).expect(200);

    const [entry] = (await researcher.get(`${lifetimeUrl}/dependents`)).body.studies;
    expect(entry).toMatchObject({ status: 'approved', matchesRecord: false });
    // The screen offers "start a new revision" here; the API would refuse a refit anyway.
    const locked = await researcher.patch(`${base}/studies/${approvedOne.id}`, {
      tau0LifetimeId: lifetime.id,
      version: entry.version,
    });
    expect(locked.status).toBe(409);
    expect(locked.body.error.code).toBe('study_locked');
    expect((await researcher.post(`${base}/studies/${approvedOne.id}/fits`, { model: entry.fitModel })).status).toBe(
      409,
    );

    const draft = await study('Refit stale');
    const stale = await researcher.patch(`${base}/studies/${draft.id}`, {
      tau0LifetimeId: lifetime.id,
      version: draft.version - 1,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect((await researcher.get(`${base}/studies/${approvedOne.id}`)).body.tau0).toBe(1e-6);
  });
});
