import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

const sessionCookie = (response: request.Response) =>
  ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith('halflight.sid='));

describe('POST /api/session', () => {
  it('when the password is wrong or the address unknown, then both get the same 401 and the attempt is audited', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    const wrongPassword = await client.post('/api/session', { email: users.researcher.email, password: 'not-the-one' });
    const unknownAddress = await client.post('/api/session', {
      email: 'nobody@tests.halflight.example',
      password: 'x',
    });
    expect(wrongPassword.status).toBe(401);
    expect(unknownAddress.status).toBe(401);
    expect(unknownAddress.body).toEqual(wrongPassword.body);
    expect(wrongPassword.body.error.code).toBe('invalid_credentials');
    const failed = await AuditEvent.findOne({ where: { action: 'sign_in_failed' }, order: [['id', 'DESC']] });
    expect(failed?.details).toEqual({ email: 'nobody@tests.halflight.example' });
    expect(failed?.ipAddress).toBeTruthy();
  });

  it('when the fields are missing, then 400 names each of them', async () => {
    const client = await apiClient(testApp.app);
    const response = await client.post('/api/session', { email: 'not an address' });
    expect(response.status).toBe(400);
    expect(response.body.error.details.map((issue: { path: string }) => issue.path).sort()).toEqual([
      'body.email',
      'body.password',
    ]);
  });

  it('when the credentials are right, then the session id changes (no fixation) and the old id is worthless', async () => {
    const { users, lab } = await createLabWithMembers(testApp.sequelize, { roles: ['reviewer'] });
    // The anonymous session's cookie is sent once, with the first token (the cookie does not roll).
    const browser = request.agent(testApp.app);
    const anonymous = await browser.get('/api/csrf-token');
    const before = sessionCookie(anonymous) ?? '';
    const signedIn = await browser
      .post('/api/session')
      .set('x-csrf-token', anonymous.body.csrfToken)
      .send({ email: users.reviewer.email, password: users.reviewer.password });
    expect(signedIn.status).toBe(200);
    const after = sessionCookie(signedIn);
    expect(before).toMatch(/^halflight.sid=/);
    expect(after).toMatch(/^halflight.sid=/);
    expect(after!.split(';')[0]).not.toBe(before.split(';')[0]);
    expect(after).toMatch(/HttpOnly/i);
    expect(after).toMatch(/SameSite=Lax/i);
    expect(signedIn.body.user.labs).toEqual([
      { labId: lab.id, labName: lab.name, isDemo: false, role: 'reviewer', requireTwoFactor: false },
    ]);
    expect(signedIn.body.mailCatcher).toBe(true);

    const replay = await request(testApp.app).get('/api/session').set('cookie', before.split(';')[0]!);
    expect(replay.status).toBe(401);
    const audit = await AuditEvent.findOne({ where: { action: 'sign_in', actorId: users.reviewer.id } });
    expect(audit).not.toBeNull();
  });
});

describe('CSRF protection', () => {
  it('when a signed-in change arrives without the token, then 403 csrf_invalid and nothing changes', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const response = await client.agent.patch('/api/account').send({ name: 'Changed without a token' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('csrf_invalid');
    expect((await client.get('/api/session')).body.user.name).toBe(users.viewer.name);
  });
});

const csrfCookie = (response: request.Response) =>
  ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith('halflight.csrf='));

describe('GET /api/session', () => {
  it('when the browser holds a valid token, then the same token comes back without a new cookie, and changes still pass', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const browser = request.agent(testApp.app);
    const anonymous = await browser.get('/api/csrf-token');
    expect(csrfCookie(anonymous)).toMatch(/HttpOnly/i);
    const signedIn = await browser
      .post('/api/session')
      .set('x-csrf-token', anonymous.body.csrfToken)
      .send({ email: users.viewer.email, password: users.viewer.password });
    // Signing in makes a new session, so a new token and its cookie.
    expect(signedIn.body.csrfToken).not.toBe(anonymous.body.csrfToken);
    expect(csrfCookie(signedIn)).toMatch(/SameSite=Strict/i);
    for (let i = 0; i < 2; i++) {
      const again = await browser.get('/api/session');
      expect(again.body.csrfToken).toBe(signedIn.body.csrfToken);
      expect(csrfCookie(again)).toBeUndefined();
    }
    const renamed = await browser
      .patch('/api/account')
      .set('x-csrf-token', signedIn.body.csrfToken)
      .send({ name: 'Renamed with the kept token' });
    expect(renamed.status).toBe(200);
    expect((await browser.get('/api/session')).body.user.name).toBe('Renamed with the kept token');
  });

  it('when the token cookie is missing or not of this session, then a new token comes with its cookie', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const sid = (await client.agent.get('/api/session')).request.cookies
      .split('; ')
      .find((pair: string) => pair.startsWith('halflight.sid='))!;
    const bare = await request(testApp.app).get('/api/session').set('cookie', sid);
    expect(bare.status).toBe(200);
    expect(csrfCookie(bare)).toContain(bare.body.csrfToken);
    const foreign = await request(testApp.app)
      .get('/api/session')
      .set('cookie', `${sid}; halflight.csrf=${encodeURIComponent('0'.repeat(64))}.${'1'.repeat(64)}`);
    expect(foreign.body.csrfToken).not.toBe(`${'0'.repeat(64)}.${'1'.repeat(64)}`);
    expect(csrfCookie(foreign)).toContain(foreign.body.csrfToken);
  });
  it('when signed in, then each request takes the person from the session row, without passport deserialising', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    // A deserializer put first in passport's chain sees every request passport.session() would
    // deserialise ('pass' hands the request on to the next one, as passport documents).
    const { passport } = testApp.app.locals.services;
    const chain = (passport as unknown as { _deserializers: unknown[] })._deserializers;
    let deserialised = 0;
    chain.unshift((_id: unknown, done: (error: unknown) => void) => {
      deserialised += 1;
      done('pass');
    });
    try {
      const answer = await client.get('/api/session');
      expect(answer.status).toBe(200);
      expect(answer.body.user.email).toBe(users.viewer.email);
      expect(deserialised).toBe(0);
    } finally {
      chain.shift();
    }
  });
});

describe('DELETE /api/session', () => {
  it('when signing out, then the session is destroyed and the next request is 401', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    expect((await client.delete('/api/session')).status).toBe(204);
    const after = await client.get('/api/session');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('not_signed_in');
  });
});

describe('the audit log', () => {
  it('when someone tries to change or delete an audit row, then the database refuses', async () => {
    const event = await AuditEvent.create({
      labId: null,
      actorId: null,
      action: 'test_event',
      targetType: null,
      targetId: null,
      details: {},
      ipAddress: null,
    });
    await expect(event.update({ action: 'rewritten' })).rejects.toThrow(/append-only/);
    await expect(event.destroy()).rejects.toThrow(/append-only/);
  });
});

describe('security headers', () => {
  it('when any page is served, then helmet sets a content security policy of our own origin', async () => {
    const response = await request(testApp.app).get('/api/health');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(response.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['permissions-policy']).toContain('camera=()');
    expect(response.headers['permissions-policy']).toContain('geolocation=()');
  });

  it('when a JSON body passes the size limit, then 413 payload_too_large', async () => {
    const client = await apiClient(testApp.app);
    const response = await client.post('/api/session', { email: 'a@b.example', password: 'x'.repeat(1_100_000) });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });
});
