import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pointAt } from '@shared/schemas/study-points';
import { AuditEvent, DecaySet, ExcitedStateLifetime, Membership } from '../../server/models';
import { apiClient, createLabWithMembers, type ApiClient } from '../support/accounts';
import { createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';
import { syntheticDecay } from '../unit/engine/support/synthetic-decay';

const testApp = await createTestApp();
afterAll(testApp.close);
let labId: string, owner: ApiClient, viewer: ApiClient, reviewer: ApiClient, outsider: ApiClient, colleague: ApiClient;
let csrf: string;
beforeAll(async () => {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'viewer', 'reviewer'] });
  const other = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  labId = lab.id;
  const signIn = async (user: { email: string; password: string }) => {
    const client = await apiClient(testApp.app);
    return { client, csrf: (await client.signIn(user)).body.csrfToken as string };
  };
  ({ client: owner, csrf } = await signIn(users.researcher));
  ({ client: viewer } = await signIn(users.viewer));
  ({ client: reviewer } = await signIn(users.reviewer));
  ({ client: outsider } = await signIn(other.users.researcher));
  // A second researcher of the same lab: the researcher of a lab made for the purpose, made a member here too.
  const second = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  await Membership.create({ labId, userId: second.users.researcher.id, role: 'researcher' });
  ({ client: colleague } = await signIn(second.users.researcher));
});

/*
 * A titration invented for the test: tau0 = 5.0 ns and K_SV = 200 M^-1, so tau = tau0/(1 + 200 [Q])
 * (Stern–Volmer for lifetimes, Lakowicz 3rd ed. eq. 8.2), made by the test's own generator (each
 * exponential convolved with a Gaussian response in closed form, Poisson noise, peak 10^4 counts,
 * 3 counts of background), independent of the engine. 1,024 channels of 25 ps, the response at 2 ns.
 */
const TAU0 = 5e-9;
const K_SV = 200;
const WIDTH = 25e-12;
const concentrationsMm = [0, 1, 2, 4];
const lifetimeAt = (mM: number) => TAU0 / (1 + K_SV * mM * 1e-3);
const decays = concentrationsMm.map((mM, i) =>
  syntheticDecay({
    channels: 1024,
    channelWidth: WIDTH,
    responseCentre: 2e-9,
    responseFwhm: 150e-12,
    components: [{ lifetime: lifetimeAt(mM), fraction: 1 }],
    seed: 2700 + i,
  }),
);
const time = (i: number) => (i * WIDTH * 1e9).toFixed(4);
const titrationFile = () =>
  Buffer.from(
    `time (ns),IRF,${concentrationsMm.map((mM) => `[Q] ${mM} mM`).join(',')}\n${decays[0]!.response
      .map((irf, i) => [time(i), irf, ...decays.map((decay) => decay.counts[i])].join(','))
      .join('\n')}\n`,
  );
const singleFile = () =>
  Buffer.from(
    `time (ns),IRF,emitter in MeCN\n${decays[0]!.response.map((irf, i) => `${time(i)},${irf},${decays[0]!.counts[i]}`).join('\n')}\n`,
  );
// A tail fit from channel 160 (4 ns, 2 ns after the pulse): the first choice the tests then change.
const TAIL = { components: 1, method: 'tail', startChannel: 160 };
const RECONVOLUTION = { components: 1, method: 'reconvolution', estimator: 'poisson', startChannel: null };

const base = (studyId: string) => `/api/labs/${labId}/studies/${studyId}`;
const refitUrl = (setId: string) => `/api/labs/${labId}/decay-sets/${setId}/refit`;
const keep = async (url: string, file: Buffer, options: object) => {
  const kept = await owner.agent
    .post(url)
    .set('x-csrf-token', csrf)
    .attach('file', file, 'titration.csv')
    .field('options', JSON.stringify(options));
  expect(kept.status, JSON.stringify(kept.body).slice(0, 400)).toBe(201);
  return kept.body;
};
/** A study with intensities at the four concentrations and a kept (tail-fitted) decay set, applied or not. */
async function studyWithSet(apply: boolean) {
  const study = await createStudy(owner, labId, crypto.randomBytes(3).toString('hex'));
  const points = concentrationsMm.map((mM) => ({ ...pointAt(mM / 1000), intensity: 1000 / (1 + K_SV * mM * 1e-3) }));
  await owner.patch(`${base(study.id)}/points`, { version: 0, points }).expect(200);
  const set = await keep(`${base(study.id)}/decay-sets`, titrationFile(), { model: TAIL });
  if (apply) await owner.post(`${base(study.id)}/decay-sets/${set.id}/apply`, { version: 1 }).expect(200);
  return { study, set };
}

interface PointAnswer {
  lifetime: number | null;
  lifetimeUncertainty: number | null;
  lifetimeSource: { decaySetId: string } | null;
}

describe('POST /api/labs/:labId/decay-sets/:setId/refit', () => {
  it('when an applied set is refitted by reconvolution, then the set, the lifetimes and tau0 of the study take the new fit, the study is fitted again and its history says so', async () => {
    const { study, set } = await studyWithSet(true);
    expect(set.model).toMatchObject({ method: 'tail', startChannel: 160 });
    const before = (await owner.get(base(study.id)).expect(200)).body;
    const answer = await owner.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version });
    expect(answer.status, JSON.stringify(answer.body).slice(0, 400)).toBe(200);
    const refitted = answer.body.set;
    expect(refitted.model).toMatchObject({ method: 'reconvolution', startChannel: null });
    expect(refitted.version).toBe(set.version + 1);
    expect(answer.body.study).toEqual({ studyId: study.id, points: 4, tau0: true });
    expect(answer.body.lifetime).toBeNull();
    // The generator's lifetimes, tau0/(1 + 200 [Q]) (Lakowicz eq. 8.2), within 1 % by reconvolution.
    refitted.outcomes.forEach((outcome: { fit: { method: string }; lifetime: { value: number } }, i: number) => {
      expect(outcome.fit.method).toBe('reconvolution');
      expect(Math.abs(outcome.lifetime.value / lifetimeAt(concentrationsMm[i]!) - 1)).toBeLessThan(0.01);
    });

    const after = (await owner.get(base(study.id)).expect(200)).body;
    (after.points as PointAnswer[]).forEach((point, i) => {
      expect(point.lifetime).toBe(refitted.outcomes[i].lifetime.value);
      expect(point.lifetimeUncertainty).toBe(refitted.outcomes[i].lifetime.standardError);
      expect(point.lifetimeSource?.decaySetId).toBe(set.id);
    });
    // tau0 is the inverse-variance weighted mean of the blanks: of one blank, itself to rounding.
    expect(Math.abs(after.tau0 / refitted.outcomes[0].lifetime.value - 1)).toBeLessThan(1e-12);
    expect(after.tau0Source).toMatchObject({ decaySetId: set.id });
    expect(after.version).toBe(before.version + 1);
    expect(after.latestFit.id).not.toBe(before.latestFit.id);
    // The lifetime K_SV of the refitted study: the generator's 200 M^-1 within 5 %.
    expect(Math.abs(after.latestFit.result.lifetime.kSv.value / K_SV - 1)).toBeLessThan(0.05);

    const history = (await owner.get(`${base(study.id)}/history`).expect(200)).body.events;
    const actions = history.map((event: { action: string }) => event.action);
    expect(actions.slice(0, 3)).toEqual(['study_fitted', 'study_lifetimes_refitted', 'decay_set_refitted']);
    const refit = history.find((event: { action: string }) => event.action === 'decay_set_refitted');
    expect(refit.details.before.model).toMatchObject({ method: 'tail' });
    expect(refit.details.after.model).toMatchObject({ method: 'reconvolution' });
  });

  it('when a lifetime was typed over after applying, then the refit leaves that point as the person typed it', async () => {
    const { study, set } = await studyWithSet(true);
    const applied = (await owner.get(base(study.id)).expect(200)).body;
    const typed = applied.points.map((point: PointAnswer & Record<string, unknown>, i: number) => ({
      ...pointAt(point.concentration as number),
      intensity: point.intensity,
      lifetime: i === 2 ? 2.4e-9 : point.lifetime,
    }));
    await owner.patch(`${base(study.id)}/points`, { version: applied.version, points: typed }).expect(200);
    const answer = await owner.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version }).expect(200);
    expect(answer.body.study).toEqual({ studyId: study.id, points: 3, tau0: true });
    const after = (await owner.get(base(study.id)).expect(200)).body.points as PointAnswer[];
    expect(after[2]).toMatchObject({ lifetime: 2.4e-9, lifetimeSource: null });
    expect(after[3]!.lifetime).toBe(answer.body.set.outcomes[3].lifetime.value);
  });

  it('when the set was never applied, then only the set changes and the study keeps its version', async () => {
    const { study, set } = await studyWithSet(false);
    const answer = await owner.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version }).expect(200);
    expect(answer.body.study).toBeNull();
    expect((await owner.get(base(study.id)).expect(200)).body.version).toBe(1);
    const listed = (await owner.get(`${base(study.id)}/decay-sets`).expect(200)).body.items;
    expect(listed[0].model.method).toBe('reconvolution');
  });

  it('when a decay cannot be fitted with the new model, then 422 names it and nothing changes', async () => {
    const { study, set } = await studyWithSet(true);
    const before = (await owner.get(base(study.id)).expect(200)).body;
    // Ten channels from 1,014 on: too few to fit (issue 17: fewer than 20 channels is refused).
    const answer = await owner.post(refitUrl(set.id), {
      model: { ...TAIL, startChannel: 1014 },
      version: set.version,
    });
    expect(answer.status).toBe(422);
    expect(answer.body.error.code).toBe('decay_not_fittable');
    expect(answer.body.error.message).toMatch(/Nothing was kept: decay "\[Q\] 0 mM" cannot be fitted/);
    const listed = (await owner.get(`${base(study.id)}/decay-sets`).expect(200)).body.items[0];
    expect(listed).toMatchObject({ version: set.version, model: { method: 'tail', startChannel: 160 } });
    expect((await owner.get(base(study.id)).expect(200)).body).toMatchObject({
      version: before.version,
      tau0: before.tau0,
    });
  });

  it('when a viewer, a reviewer who does not own the study, a member of another lab or a stale version asks, then 403, 403, 404 and 409, and nothing changes', async () => {
    const { set } = await studyWithSet(false);
    const body = { model: RECONVOLUTION, version: set.version };
    expect((await viewer.post(refitUrl(set.id), body)).status).toBe(403);
    const notOwner = await reviewer.post(refitUrl(set.id), body);
    expect(notOwner.status).toBe(403);
    expect(notOwner.body.error.code).toBe('not_owner');
    // Another lab's member asks through their own lab: the set is not found there.
    const outsiderLab = (await outsider.get('/api/session').expect(200)).body.user.labs[0].labId as string;
    expect((await outsider.post(`/api/labs/${outsiderLab}/decay-sets/${set.id}/refit`, body)).status).toBe(404);
    expect((await outsider.post(refitUrl(set.id), body)).status).toBe(404);
    const stale = await owner.post(refitUrl(set.id), { ...body, version: set.version + 5 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    const listed = (await owner.get(`/api/labs/${labId}/decay-sets/${set.id}/decays/0/curves`).expect(200)).body;
    expect(listed.startChannel).toBe(160);
  });

  it('when a library set is refitted, then its lifetime record takes the new value, the change is in the audit, and the studies using the record are listed as holding the older value, not refitted', async () => {
    const emitter = (await createStudy(owner, labId, crypto.randomBytes(3).toString('hex'))).emitter;
    const set = await keep(`/api/labs/${labId}/compounds/${emitter.id}/decay-lifetimes`, singleFile(), {
      model: TAIL,
      solvent: 'acetonitrile',
      atmosphere: 'argon',
      notes: 'degassed by three freeze-pump-thaw cycles',
    });
    const user = await createStudy(owner, labId, crypto.randomBytes(3).toString('hex'), {
      newEmitterName: undefined,
      emitterId: emitter.id,
      tau0: undefined,
      tau0Uncertainty: undefined,
      tau0LifetimeId: set.lifetimeId,
    });
    const tau0Before = (await owner.get(base(user.id)).expect(200)).body.tau0;

    const answer = await owner.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version });
    expect(answer.status, JSON.stringify(answer.body).slice(0, 400)).toBe(200);
    const lifetime = answer.body.set.outcomes[0].lifetime;
    expect(answer.body.study).toBeNull();
    expect(answer.body.lifetime).toEqual({
      lifetimeId: set.lifetimeId,
      value: lifetime.value,
      uncertainty: lifetime.standardError,
      outdatedStudies: 1,
    });
    // The generator's 5.0 ns within 1 % by reconvolution.
    expect(Math.abs(lifetime.value / TAU0 - 1)).toBeLessThan(0.01);
    const record = (await owner.get(`/api/labs/${labId}/compounds/${emitter.id}`).expect(200)).body.lifetimes.find(
      (row: { id: string }) => row.id === set.lifetimeId,
    );
    expect(record).toMatchObject({
      value: lifetime.value,
      uncertainty: lifetime.standardError,
      method: 'TCSPC decay fit: 1 exponential by reconvolution, Poisson likelihood',
      source: 'from decay titration.csv',
      notes: 'degassed by three freeze-pump-thaw cycles',
    });
    const dependents = (
      await owner.get(`/api/labs/${labId}/compounds/${emitter.id}/lifetimes/${set.lifetimeId}/dependents`).expect(200)
    ).body.studies;
    expect(dependents).toEqual([expect.objectContaining({ studyId: user.id, matchesRecord: false })]);
    expect((await owner.get(base(user.id)).expect(200)).body.tau0).toBe(tau0Before);
  });

  it('when a library set is refitted, then only its keeper or a reviewer may, and the refit and the record change are each in the audit', async () => {
    const emitter = (await createStudy(owner, labId, crypto.randomBytes(3).toString('hex'))).emitter;
    const set = await keep(`/api/labs/${labId}/compounds/${emitter.id}/decay-lifetimes`, singleFile(), {
      model: TAIL,
      solvent: 'acetonitrile',
      atmosphere: 'nitrogen',
    });
    expect(set.createdById).toBeTruthy();
    const listed = (await owner.get(`/api/labs/${labId}/compounds/${emitter.id}/decay-sets`).expect(200)).body.items;
    expect(listed.map((row: { id: string }) => row.id)).toEqual([set.id]);
    const before = await ExcitedStateLifetime.findByPk(set.lifetimeId);

    const refused = await colleague.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('not_yours');
    expect((await DecaySet.findByPk(set.id))!.version).toBe(set.version);
    expect((await ExcitedStateLifetime.findByPk(set.lifetimeId))!.value).toBe(before!.value);
    expect((await viewer.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version })).status).toBe(403);

    const answer = await reviewer.post(refitUrl(set.id), { model: RECONVOLUTION, version: set.version });
    expect(answer.status, JSON.stringify(answer.body).slice(0, 400)).toBe(200);
    expect(answer.body.set.model.method).toBe('reconvolution');
    // The generator's 5.0 ns within 1 % by reconvolution.
    expect(Math.abs(answer.body.lifetime.value / TAU0 - 1)).toBeLessThan(0.01);
    const refitted = await AuditEvent.findOne({ where: { labId, action: 'decay_set_refitted', targetId: emitter.id } });
    expect(refitted?.details).toMatchObject({ decaySetId: set.id, after: { model: { method: 'reconvolution' } } });
    const changed = await AuditEvent.findOne({
      where: { labId, action: 'lifetime_changed', targetId: set.lifetimeId },
    });
    expect(changed?.details).toMatchObject({ decaySetId: set.id });
    expect((await ExcitedStateLifetime.findByPk(set.lifetimeId))!.value).toBe(answer.body.lifetime.value);
  });
});
