import { afterAll, describe, expect, it } from 'vitest';
import { startMailCatcher } from '../../server/mail/catcher';
import type { MailCatcher } from '../../server/mail/catcher';
import { createMailer } from '../../server/mail/mailer';
import { CaughtMail } from '../../server/models';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createTestApp } from '../support/test-app';

// The relay this app sends to is down at first: a catcher started and stopped again, so its
// port is known and nothing listens there. This file runs the only job worker, so no other
// worker with a live relay can take the job.
const probe = await startMailCatcher();
const relayPort = probe.port;
await probe.stop();
const mailer = createMailer(`smtp://127.0.0.1:${relayPort}`, 'Halflight tests <tests@halflight.invalid>', {
  tagForCatcher: true,
});
const testApp = await createTestApp({ mailer });
let relay: MailCatcher | undefined;
afterAll(async () => {
  await testApp.close();
  mailer.close();
  await relay?.stop();
});

const jobsWaiting = async () => {
  const [rows] = await testApp.sequelize.query(
    "SELECT count(*)::int AS count FROM pgboss.job WHERE name LIKE 'mail-%' AND state < 'completed'",
  );
  return (rows as Array<{ count: number }>)[0]!.count;
};

describe('POST /api/password-resets while the mail relay is down', () => {
  it('when the relay is down, then the request answers 202 at once and the mail arrives after the relay is back', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    const before = await CaughtMail.count({ where: {} });

    const asked = await client.post('/api/password-resets', { email: users.researcher.email });
    expect(asked.status).toBe(202);
    expect(await CaughtMail.count({ where: {} })).toBe(before);

    // The worker tries, fails (connection refused) and schedules a retry: the mail is kept.
    const deadline = Date.now() + 15_000;
    while (Date.now() < deadline) {
      const [rows] = await testApp.sequelize.query(
        "SELECT count(*)::int AS count FROM pgboss.job WHERE name = 'mail-password-reset' AND state = 'retry'",
      );
      if ((rows as Array<{ count: number }>)[0]!.count > 0) break;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    expect(await jobsWaiting()).toBeGreaterThan(0);
    expect(await CaughtMail.count({ where: {} })).toBe(before);

    relay = await startMailCatcher({ port: relayPort });
    const { mail, link } = await latestMailTo(users.researcher.email);
    expect(mail?.subject).toBe('Set a new Halflight password');
    // The link in the late mail works.
    const token = new URL(link!).searchParams.get('token')!;
    const done = await client.post('/api/password-resets/complete', { token, password: 'after-the-outage-42' });
    expect(done.status).toBe(204);
    await client.signIn({ email: users.researcher.email, password: 'after-the-outage-42' });
  });
});
