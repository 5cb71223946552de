import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

/** The stored session rows of one person. */
const sessionsOf = (userId: string) =>
  testApp.sequelize.query<{ sid: string; sess: Record<string, unknown> }>(
    `SELECT sid, sess FROM sessions WHERE sess #>> '{passport,user}' = $1`,
    { bind: [userId], type: QueryTypes.SELECT },
  );

async function signedIn() {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const client = await apiClient(testApp.app);
  await client.signIn(users.researcher);
  return { lab, user: users.researcher, client };
}

/**
 * Session hashes made while `send` runs: express-session tells whether a session changed by a SHA-1
 * of its JSON (its function `hash`, index.js). Its cookie check also takes SHA-1s (cookie-signature
 * compares the signatures through them): those are not counted.
 */
async function sessionHashesDuring(send: () => Promise<{ status: number }>): Promise<number> {
  const plainCreateHash = crypto.createHash;
  let hashes = 0;
  const createHash = vi.spyOn(crypto, 'createHash').mockImplementation((algorithm, options) => {
    if (algorithm === 'sha1' && /at hash \(.*express-session[/\\]index\.js/.test(new Error().stack ?? '')) hashes += 1;
    return plainCreateHash(algorithm, options);
  });
  try {
    expect((await send()).status).toBe(200);
    return hashes;
  } finally {
    createHash.mockRestore();
  }
}

describe('telling whether a request changed its session', () => {
  it('when a signed-in person reads, then the session is hashed once, when it is read (not again for the cookie, the save and the touch)', async () => {
    const { lab, client } = await signedIn();
    expect(await sessionHashesDuring(() => client.get(`/api/labs/${lab.id}/studies`))).toBe(1);
    expect(await sessionHashesDuring(() => client.get('/api/session'))).toBe(1);
  });

  it('when a request changes a session read from the store, then the change is saved and the person stays signed in', async () => {
    const { user, client } = await signedIn();
    const setup = await client.post('/api/account/two-factor/setup');
    expect(setup.status).toBe(200);
    const [row] = await sessionsOf(user.id);
    expect(row!.sess.totpSetupSecret).toBe(setup.body.secret);
    expect((await client.get('/api/session')).body.user.id).toBe(user.id);
  });

  it('when a read changes nothing, then the stored session is left as it was', async () => {
    const { lab, user, client } = await signedIn();
    const before = await sessionsOf(user.id);
    expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
    expect(await sessionsOf(user.id)).toEqual(before);
  });
});
