import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultRateLimits } from '../../server/middleware/rate-limits';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

// Each app here counts under a namespace of its own (the shared test database keeps every
// other test's sign-ins too); two apps that should count together share one.
const namespace = () => `test-${crypto.randomBytes(4).toString('hex')}`;
const base = await createTestApp();
const opened = [base];
afterAll(async () => {
  for (const app of opened.reverse()) await app.close();
});

async function appWithRealLimits(
  options: { rateLimitNamespace?: string; trustProxy?: number | string[]; perIp?: number } = {},
) {
  const app = await createTestApp({
    sequelize: base.sequelize,
    rateLimits: options.perIp
      ? {
          ...defaultRateLimits,
          signInFailuresPerIp: { ...defaultRateLimits.signInFailuresPerIp, points: options.perIp },
        }
      : defaultRateLimits,
    rateLimitNamespace: options.rateLimitNamespace ?? namespace(),
    trustProxy: options.trustProxy,
    jobWorker: false,
  });
  opened.push(app);
  return app;
}

const freshAddress = () => `nobody-${crypto.randomBytes(5).toString('hex')}@tests.halflight.example`;

describe('POST /api/session attempt limits', () => {
  it('when one address tries 50 fresh e-mail addresses, then it gets 429 before the 50th', async () => {
    const { app } = await appWithRealLimits();
    const client = await apiClient(app);
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 50; attempt++) {
      statuses.push((await client.post('/api/session', { email: freshAddress(), password: 'guess-guess-1' })).status);
    }
    const firstRefusal = statuses.indexOf(429);
    expect(firstRefusal).toBeGreaterThan(0);
    expect(firstRefusal).toBeLessThan(49);
    expect(statuses.slice(0, firstRefusal).every((status) => status === 401)).toBe(true);
    const refused = await client.post('/api/session', { email: freshAddress(), password: 'guess-guess-1' });
    expect(refused.body.error.code).toBe('rate_limited');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
  }, 180_000);

  it('when one person signs in 15 times in a row, then every sign-in succeeds; their wrong passwords are still limited', async () => {
    const { app } = await appWithRealLimits();
    const { users } = await createLabWithMembers(base.sequelize, { roles: ['viewer'] });
    for (let attempt = 0; attempt < 15; attempt++) {
      const client = await apiClient(app);
      expect((await client.post('/api/session', users.viewer)).status, `sign-in ${attempt + 1}`).toBe(200);
    }
    const attacker = await apiClient(app);
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 12; attempt++) {
      statuses.push((await attacker.post('/api/session', { ...users.viewer, password: `wrong-${attempt}` })).status);
    }
    expect(statuses.slice(0, defaultRateLimits.signInFailuresPerAccount.points)).toEqual(
      Array(defaultRateLimits.signInFailuresPerAccount.points).fill(401),
    );
    expect(statuses.at(-1)).toBe(429);
  }, 180_000);

  it('when two instances share one database, then failures on either count together', async () => {
    const shared = namespace();
    const first = await appWithRealLimits({ rateLimitNamespace: shared });
    const second = await appWithRealLimits({ rateLimitNamespace: shared });
    const { users } = await createLabWithMembers(base.sequelize, { roles: ['viewer'] });
    const limit = defaultRateLimits.signInFailuresPerAccount.points;
    for (let attempt = 0; attempt < limit; attempt++) {
      const client = await apiClient(attempt % 2 ? second.app : first.app);
      expect((await client.post('/api/session', { ...users.viewer, password: `wrong-${attempt}` })).status).toBe(401);
    }
    // Both instances now refuse this account, and so would one started later (the counters are rows).
    for (const instance of [first, second, await appWithRealLimits({ rateLimitNamespace: shared })]) {
      const client = await apiClient(instance.app);
      expect((await client.post('/api/session', users.viewer)).status).toBe(429);
    }
  }, 120_000);

  it('when a client that is not the trusted proxy sends X-Forwarded-For, then rotating it does not escape the limit', async () => {
    // Only 10.9.8.7 is trusted; the test client connects from 127.0.0.1.
    const { app } = await appWithRealLimits({ trustProxy: ['10.9.8.7'], perIp: 5 });
    const client = await apiClient(app);
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 6; attempt++) {
      const response = await client.agent
        .post('/api/session')
        .set('x-forwarded-for', `198.51.100.${attempt}`)
        .set('x-csrf-token', (await client.get('/api/csrf-token')).body.csrfToken)
        .send({ email: freshAddress(), password: 'guess-guess-1' });
      statuses.push(response.status);
    }
    expect(statuses.at(-1)).toBe(429);
  }, 120_000);

  it('when the connecting proxy is trusted, then each forwarded client address has its own budget', async () => {
    const { app } = await appWithRealLimits({ trustProxy: ['loopback'], perIp: 5 });
    const client = await apiClient(app);
    const attempt = async (clientAddress: string) =>
      (
        await client.agent
          .post('/api/session')
          .set('x-forwarded-for', clientAddress)
          .set('x-csrf-token', (await client.get('/api/csrf-token')).body.csrfToken)
          .send({ email: freshAddress(), password: 'guess-guess-1' })
      ).status;
    for (let count = 0; count < 5; count++) {
      expect(await attempt('198.51.100.7')).toBe(401);
    }
    expect(await attempt('198.51.100.7')).toBe(429);
    expect(await attempt('203.0.113.9')).toBe(401);
  }, 120_000);
});

describe('reset and invitation limits', () => {
  it('when people behind one address ask for resets, then each address of theirs has its own budget', async () => {
    const { app } = await appWithRealLimits();
    const client = await apiClient(app);
    for (let person = 0; person < 8; person++) {
      expect((await client.post('/api/password-resets', { email: freshAddress() })).status).toBe(202);
    }
    const target = freshAddress();
    const statuses: number[] = [];
    for (let attempt = 0; attempt < defaultRateLimits.resetRequestsPerAddress.points + 1; attempt++) {
      statuses.push((await client.post('/api/password-resets', { email: target })).status);
    }
    expect(statuses.at(-1)).toBe(429);
  });

  it('when an admin invites a class of 40, then every invitation goes out', async () => {
    const { app } = await appWithRealLimits();
    const { lab, users } = await createLabWithMembers(base.sequelize, { roles: ['admin'] });
    const admin = await apiClient(app);
    await admin.signIn(users.admin);
    for (let student = 0; student < 40; student++) {
      const response = await admin.post(`/api/labs/${lab.id}/invitations`, { email: freshAddress(), role: 'viewer' });
      expect(response.status, `invitation ${student + 1}`).toBe(201);
    }
  }, 120_000);
});
