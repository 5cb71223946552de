import { Writable } from 'node:stream';
import { pino } from 'pino';
import { afterAll, describe, expect, it } from 'vitest';
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
