import { generateSync } from 'otplib';
import { afterAll, describe, expect, it } from 'vitest';
import { User } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import type { TestUser } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

// The code an authenticator app would show `stepsAhead` 30-second steps from now (RFC 6238).
const codeFor = (secret: string, stepsAhead = 0) =>
  generateSync({ secret, epoch: Math.floor(Date.now() / 1000) + stepsAhead * 30 });

type Client = Awaited<ReturnType<typeof apiClient>>;

async function enrol(client: Client) {
  const setup = await client.post('/api/account/two-factor/setup');
  expect(setup.status).toBe(200);
  expect(setup.body.otpauthUri).toMatch(/^otpauth:\/\/totp\/Halflight:.+secret=/);
  expect(setup.body.qrCode).toMatch(/^data:image\/png;base64,/);
  const wrong = await client.post('/api/account/two-factor', {
    code: '000000' === codeFor(setup.body.secret) ? '111111' : '000000',
  });
  expect(wrong.status).toBe(400);
  const confirmed = await client.post('/api/account/two-factor', { code: codeFor(setup.body.secret) });
  expect(confirmed.status).toBe(201);
  return { secret: setup.body.secret as string, recoveryCodes: confirmed.body.recoveryCodes as string[] };
}

/** Password first; answers the 202 that asks for the second step. */
async function firstStep(user: TestUser) {
  const client = await apiClient(testApp.app);
  const answer = await client.post('/api/session', { email: user.email, password: user.password });
  expect(answer.status).toBe(202);
  expect(answer.body).toEqual({ twoFactorRequired: true, csrfToken: expect.any(String) });
  client.setCsrfToken(answer.body.csrfToken);
  return client;
}

describe('two-step sign-in', () => {
  it('when a person turns it on, then sign-in needs a code from the app, and a code works only once', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const owner = await apiClient(testApp.app);
    await owner.signIn(users.researcher);
    const { secret, recoveryCodes } = await enrol(owner);
    expect(recoveryCodes).toHaveLength(10);
    expect(new Set(recoveryCodes).size).toBe(10);
    const session = (await owner.get('/api/session')).body;
    expect(session.twoFactor).toEqual({ enabled: true, verified: true, recoveryCodesLeft: 10 });
    // Only hashes are stored.
    const stored = await testApp.sequelize.query('SELECT code_hash FROM recovery_codes WHERE user_id = :id', {
      replacements: { id: users.researcher.id },
    });
    expect(JSON.stringify(stored[0])).not.toContain(recoveryCodes[0]!.replace(/-/g, ''));

    const client = await firstStep(users.researcher);
    expect((await client.get('/api/session')).status).toBe(401);
    expect((await client.post('/api/session/second-step', { code: '12345' })).status).toBe(400);
    const code = codeFor(secret, 1);
    const wrongCode = code === '999999' ? '999998' : '999999';
    expect((await client.post('/api/session/second-step', { code: wrongCode })).status).toBe(401);
    const passed = await client.post('/api/session/second-step', { code });
    expect(passed.status).toBe(200);
    expect(passed.body.user.email).toBe(users.researcher.email);
    expect(passed.body.twoFactor.verified).toBe(true);

    // The same code a second time (someone watching the screen) is refused.
    const replay = await firstStep(users.researcher);
    expect((await replay.post('/api/session/second-step', { code })).status).toBe(401);
  });

  it('when the phone is lost, then a recovery code signs in once', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const owner = await apiClient(testApp.app);
    await owner.signIn(users.viewer);
    const { recoveryCodes } = await enrol(owner);
    const client = await firstStep(users.viewer);
    const passed = await client.post('/api/session/second-step', { recoveryCode: recoveryCodes[3]!.toLowerCase() });
    expect(passed.status).toBe(200);
    expect(passed.body.twoFactor.recoveryCodesLeft).toBe(9);
    const again = await firstStep(users.viewer);
    expect((await again.post('/api/session/second-step', { recoveryCode: recoveryCodes[3] })).status).toBe(401);
  });

  it('when a lab requires it, then its reviewers without it are stopped at the lab, viewers are not, and the admin cannot turn it off', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['admin', 'reviewer', 'viewer'] });
    const admin = await apiClient(testApp.app);
    await admin.signIn(users.admin);
    const early = await admin.put(`/api/labs/${lab.id}/sign-in-rules`, { requireTwoFactor: true });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('two_factor_off');
    await enrol(admin);
    expect((await admin.put(`/api/labs/${lab.id}/sign-in-rules`, { requireTwoFactor: true })).status).toBe(200);
    expect((await admin.get(`/api/labs/${lab.id}/members`)).status).toBe(200);
    expect((await admin.get('/api/session')).body.user.labs[0].requireTwoFactor).toBe(true);

    const reviewer = await apiClient(testApp.app);
    await reviewer.signIn(users.reviewer);
    const stopped = await reviewer.get(`/api/labs/${lab.id}/studies`);
    expect(stopped.status).toBe(403);
    expect(stopped.body.error.code).toBe('two_factor_required');
    const viewer = await apiClient(testApp.app);
    await viewer.signIn(users.viewer);
    expect((await viewer.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);

    await enrol(reviewer);
    expect((await reviewer.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);

    const off = await admin.post('/api/account/two-factor/disable', { password: users.admin.password });
    expect(off.status).toBe(409);
    expect(off.body.error.code).toBe('two_factor_required');
    expect((await User.findByPk(users.admin.id))!.totpEnabledAt).not.toBeNull();
  });

  it('when a person turns it off with their password, then sign-in is one step again', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const owner = await apiClient(testApp.app);
    await owner.signIn(users.viewer);
    await enrol(owner);
    expect((await owner.post('/api/account/two-factor/disable', { password: 'not-the-password' })).status).toBe(400);
    expect((await owner.post('/api/account/two-factor/disable', { password: users.viewer.password })).status).toBe(204);
    await (await apiClient(testApp.app)).signIn(users.viewer);
  });
});
