import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sessionIdleMs, sessionSlideEveryMs } from '../../server/auth/session';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

type Row = {
  sid: string;
  sess: { cookie: { expires: string }; passport?: { user: string }; signedInAt?: number };
  expire: Date;
};

/** The stored sessions of one person. */
const sessionsOf = (userId: string) =>
  testApp.sequelize.query<Row>(`SELECT sid, sess, expire FROM sessions WHERE sess #>> '{passport,user}' = $1`, {
    bind: [userId],
    type: QueryTypes.SELECT,
  });

/** Moves a person's stored expiry (the row's and the cookie data's) back by `ms`, as if the last slide were that long ago. */
async function ageSessionsOf(userId: string, ms: number) {
  for (const row of await sessionsOf(userId)) {
    const expires = new Date(Date.parse(row.sess.cookie.expires) - ms);
    await testApp.sequelize.query(
      `UPDATE sessions SET expire = expire - make_interval(secs => $2::double precision / 1000),
         sess = jsonb_set(sess::jsonb, '{cookie,expires}', to_jsonb($3::text))::json
       WHERE sid = $1`,
      { bind: [row.sid, ms, expires.toISOString()] },
    );
  }
}

/** The session cookie an answer sets, if any (GET /api/session also renews the CSRF cookie). */
const sessionCookieOf = (answer: { headers: Record<string, unknown> }) =>
  ([answer.headers['set-cookie'] ?? []].flat() as string[]).find((cookie) => cookie.startsWith('halflight.sid='));

async function signedIn() {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const client = await apiClient(testApp.app);
  await client.signIn(users.researcher);
  return { lab, user: users.researcher, client, listUrl: `/api/labs/${lab.id}/studies` };
}

describe('the sliding idle timeout', () => {
  it('when a fresh session reads, then no cookie is sent and the stored session is not written', async () => {
    const { user, client, listUrl } = await signedIn();
    const before = await sessionsOf(user.id);
    for (const url of [listUrl, '/api/session']) {
      const answer = await client.get(url);
      expect(answer.status).toBe(200);
      expect(sessionCookieOf(answer), url).toBeUndefined();
    }
    expect(await sessionsOf(user.id)).toEqual(before);
  });

  it('when the expiry was moved more than five minutes ago, then one request moves it and sends the cookie once', async () => {
    const { user, client, listUrl } = await signedIn();
    const [signedInRow] = await sessionsOf(user.id);
    await ageSessionsOf(user.id, sessionSlideEveryMs + 60_000);

    const slid = await client.get(listUrl);
    expect(slid.status).toBe(200);
    const cookie = sessionCookieOf(slid)!;
    const cookieExpires = Date.parse(/Expires=([^;]+)/.exec(cookie)![1]!);
    // The cookie and the stored row both end a whole idle timeout after this request (HTTP dates
    // carry whole seconds, hence the margin).
    expect(Math.abs(cookieExpires - (Date.now() + sessionIdleMs))).toBeLessThan(60_000);
    const [row] = await sessionsOf(user.id);
    expect(row!.sid).toBe(signedInRow!.sid);
    expect(Math.abs(row!.expire.getTime() - (Date.now() + sessionIdleMs))).toBeLessThan(60_000);
    expect(Date.parse(row!.sess.cookie.expires)).toBeCloseTo(row!.expire.getTime(), -4);
    // Who is signed in, and since when, are left as they were.
    expect(row!.sess.passport).toEqual(signedInRow!.sess.passport);
    expect(row!.sess.signedInAt).toBe(signedInRow!.sess.signedInAt);

    const next = await client.get(listUrl);
    expect(next.status).toBe(200);
    expect(sessionCookieOf(next)).toBeUndefined();
  });

  it('when the idle timeout has passed, then the session is signed out', async () => {
    const { user, client, listUrl } = await signedIn();
    await ageSessionsOf(user.id, sessionIdleMs + 60_000);
    const after = await client.get(listUrl);
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('not_signed_in');
  });

  it('when a session is ended while a request that moves its expiry is running, then it stays ended', async () => {
    const { user, client, listUrl } = await signedIn();
    await ageSessionsOf(user.id, sessionSlideEveryMs + 60_000);
    // Hold the studies table, so the list request has read its session and waits inside its work.
    const holder = await testApp.sequelize.transaction();
    let pending: Promise<{ status: number }> | undefined;
    try {
      await testApp.sequelize.query('LOCK TABLE studies IN ACCESS EXCLUSIVE MODE', { transaction: holder });
      pending = client.get(listUrl).then((answer) => answer);
      for (let waited = 0; ; waited += 20) {
        const [{ waiting }] = await testApp.sequelize.query<{ waiting: number }>(
          `SELECT count(*)::int AS waiting FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query ILIKE '%studies%'`,
          { type: QueryTypes.SELECT },
        );
        if (waiting > 0) break;
        expect(waited, 'the list request never reached the studies table').toBeLessThan(10_000);
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
      // Signed out from elsewhere (another browser ending it, a password change) meanwhile.
      await testApp.sequelize.query(`DELETE FROM sessions WHERE sess #>> '{passport,user}' = $1`, { bind: [user.id] });
    } finally {
      await holder.commit();
    }
    expect((await pending!).status).toBe(200);
    expect(await sessionsOf(user.id)).toEqual([]);
    expect((await client.get(listUrl)).status).toBe(401);
  });
});
