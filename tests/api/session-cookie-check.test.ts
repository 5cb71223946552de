import crypto from 'node:crypto';
import { afterAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
// A second app in the same process, with a secret of its own (createTestApp makes a random one).
const otherApp = await createTestApp({ sequelize: testApp.sequelize });
afterAll(async () => {
  await otherApp.close();
  await testApp.close();
});

async function signedIn() {
  const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  const client = await apiClient(testApp.app);
  const signIn = await client.signIn(users.researcher);
  const sessionCookie = ([] as string[])
    .concat(signIn.headers['set-cookie'] ?? [])
    .map((line) => line.split(';')[0]!)
    .find((pair) => pair.startsWith('halflight.sid='));
  if (!sessionCookie) throw new Error('sign-in set no session cookie');
  return { lab, client, sessionCookie };
}

/**
 * HMACs taken by express-session's cookie check while `send` runs: cookie-signature's unsign
 * signs the id again with the secret (its `sign`, an HMAC-SHA256) to compare it with the cookie's.
 */
async function cookieHmacsDuring<T>(send: () => Promise<T>): Promise<[T, number]> {
  const plainCreateHmac = crypto.createHmac;
  let hmacs = 0;
  const createHmac = vi.spyOn(crypto, 'createHmac').mockImplementation((algorithm, key, options) => {
    if (/cookie-signature[/\\]index\.js/.test(new Error().stack ?? '')) hmacs += 1;
    return plainCreateHmac(algorithm, key, options);
  });
  try {
    return [await send(), hmacs];
  } finally {
    createHmac.mockRestore();
  }
}

/** The same cookie (name=value) with the last character of its signature changed. */
const tampered = (cookie: string) => {
  const at = cookie.indexOf('=');
  const value = decodeURIComponent(cookie.slice(at + 1));
  return `${cookie.slice(0, at + 1)}${encodeURIComponent(value.slice(0, -1) + (value.endsWith('A') ? 'B' : 'A'))}`;
};

describe("checking the session cookie's signature", () => {
  it('when a signed-in person reads again with the same cookie, then its signature is not worked out again', async () => {
    const { lab, client } = await signedIn();
    const [first] = await cookieHmacsDuring(() => client.get(`/api/labs/${lab.id}/studies`));
    expect(first.status).toBe(200);
    const [again, hmacs] = await cookieHmacsDuring(() => client.get(`/api/labs/${lab.id}/studies`));
    expect(again.status).toBe(200);
    expect(again.body.items).toEqual([]);
    expect(hmacs).toBe(0);
  });

  it('when the signature of a cookie already seen is changed, then the request is signed out', async () => {
    const { lab, client, sessionCookie } = await signedIn();
    expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
    const forged = tampered(sessionCookie);
    expect(forged).not.toBe(sessionCookie);
    const [answer, hmacs] = await cookieHmacsDuring(() =>
      request(testApp.app).get(`/api/labs/${lab.id}/studies`).set('cookie', forged),
    );
    expect(answer.status).toBe(401);
    expect(hmacs).toBeGreaterThan(0);
    // The real cookie still works afterwards.
    const session = await request(testApp.app).get('/api/session').set('cookie', sessionCookie);
    expect(session.status).toBe(200);
    expect(session.body.user.id).toBeTruthy();
  });

  it('when a cookie verified by one app reaches an app with another secret, then that app does not take it', async () => {
    const { lab, client, sessionCookie } = await signedIn();
    expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
    const elsewhere = await request(otherApp.app).get(`/api/labs/${lab.id}/studies`).set('cookie', sessionCookie);
    expect(elsewhere.status).toBe(401);
    expect((await request(otherApp.app).get('/api/session').set('cookie', sessionCookie)).status).toBe(401);
  });

  it('when a person signs out, then the same cookie no longer signs them in', async () => {
    const { lab, client, sessionCookie } = await signedIn();
    expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
    expect((await client.delete('/api/session')).status).toBe(204);
    const after = await request(testApp.app).get(`/api/labs/${lab.id}/studies`).set('cookie', sessionCookie);
    expect(after.status).toBe(401);
  });
});
