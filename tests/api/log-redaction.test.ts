import { Writable } from 'node:stream';
import { pino } from 'pino';
import { afterAll, describe, expect, it } from 'vitest';
import { defineRoute } from '../../server/http/define-route';
import { apiRoutes } from '../../server/routes';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createTestApp } from '../support/test-app';

// Everything the app logs at info level and above, line by line.
const lines: string[] = [];
const sink = new Writable({
  write(chunk: Buffer, _encoding, done) {
    lines.push(chunk.toString('utf8'));
    done();
  },
});
const testApp = await createTestApp({ logger: pino({ level: 'info' }, sink) });
afterAll(testApp.close);

// The same app logging warnings and errors only (LOG_LEVEL=warn), with a route that fails.
const warnLines: string[] = [];
const warnSink = new Writable({
  write(chunk: Buffer, _encoding, done) {
    warnLines.push(chunk.toString('utf8'));
    done();
  },
});
const failing = defineRoute({
  method: 'get',
  path: '/api/log-test/failure',
  summary: 'Fails on purpose (log test)',
  tags: ['system'],
  access: 'public',
  responses: { 500: { description: 'always' } },
  handler: () => {
    throw new Error('failed on purpose');
  },
});
const warnApp = await createTestApp({
  sequelize: testApp.sequelize,
  logger: pino({ level: 'warn' }, warnSink),
  routes: [...apiRoutes, failing],
});
afterAll(warnApp.close);

const cookieValues = (header: string[] | string | undefined) =>
  ([] as string[]).concat(header ?? []).map((cookie) => cookie.split(';')[0]!.split('=')[1]!);

describe('the request log', () => {
  it('when people sign in, reset a password and open an invitation, then no cookie, CSRF token, password or link token is written', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['admin', 'viewer'] });
    const secrets: string[] = [users.admin.password];

    const admin = await apiClient(testApp.app);
    const signedIn = await admin.signIn(users.admin);
    secrets.push(signedIn.body.csrfToken, ...cookieValues(signedIn.headers['set-cookie']));
    expect((await admin.get('/api/session')).status).toBe(200);

    const invitee = `logged-${Date.now()}@tests.halflight.example`;
    await admin.post(`/api/labs/${lab.id}/invitations`, { email: invitee, role: 'viewer' });
    const invitationToken = (await latestMailTo(invitee)).link!.split('/invitations/')[1]!;
    secrets.push(invitationToken);
    const guest = await apiClient(testApp.app);
    expect((await guest.get(`/api/invitations/${invitationToken}`)).status).toBe(200);

    await guest.post('/api/password-resets', { email: users.viewer.email });
    const resetLink = (await latestMailTo(users.viewer.email)).link!;
    const resetToken = new URL(resetLink).searchParams.get('token')!;
    secrets.push(resetToken);
    await guest.get(`/reset-password?token=${resetToken}`);
    const newPassword = 'a-logged-nowhere-passphrase';
    secrets.push(newPassword);
    expect(
      (await guest.post('/api/password-resets/complete', { token: resetToken, password: newPassword })).status,
    ).toBe(204);

    const log = lines.join('');
    expect(log).toContain('/api/invitations/[Redacted]');
    expect(log).toContain('token=[Redacted]');
    expect(log).toContain('"cookie":"[Redacted]"');
    for (const secret of secrets) {
      expect(secret.length).toBeGreaterThan(8);
      expect(log.includes(secret), `the log holds a secret: ${secret.slice(0, 6)}…`).toBe(false);
    }
  });
});

describe('the log at warn level', () => {
  it('when requests succeed and one fails, then only the failure is written, naming its method and redacted address', async () => {
    const client = await apiClient(warnApp.app);
    expect((await client.get('/api/csrf-token')).status).toBe(200);
    expect((await client.get('/api/log-test/failure?token=secret-link-token')).status).toBe(500);
    const entries = warnLines.map((line) => JSON.parse(line) as { msg: string; req?: { method: string; url: string } });
    expect(entries.map((entry) => entry.msg)).toEqual(['unhandled error']);
    expect(entries[0]!.req).toMatchObject({ method: 'GET', url: '/api/log-test/failure?token=[Redacted]' });
    expect(warnLines.join('')).not.toContain('secret-link-token');
  });
});
