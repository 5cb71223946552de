import { afterAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

async function twoBrowsersOf(role: 'viewer' | 'researcher' = 'viewer') {
  const { users } = await createLabWithMembers(testApp.sequelize, { roles: [role] });
  const user = users[role];
  const first = await apiClient(testApp.app);
  await first.signIn(user);
  const second = await apiClient(testApp.app);
  await second.signIn(user);
  return { user, first, second };
}

describe('POST /api/account/password ends the other sessions', () => {
  it('when the password changes, then this browser stays signed in under a new session and every other one is signed out', async () => {
    const { user, first, second } = await twoBrowsersOf();
    const changed = await first.post('/api/account/password', {
      currentPassword: user.password,
      newPassword: 'a-changed-passphrase-77',
    });
    expect(changed.status).toBe(200);
    first.setCsrfToken(changed.body.csrfToken);
    expect((await first.get('/api/session')).status).toBe(200);
    expect((await first.patch('/api/account', { name: 'Still here' })).status).toBe(200);
    expect((await second.get('/api/session')).status).toBe(401);
  });
});

describe('POST /api/password-resets/complete ends every session', () => {
  it('when a reset is completed, then every session of the person is signed out', async () => {
    const { user, first, second } = await twoBrowsersOf();
    const stranger = await apiClient(testApp.app);
    await stranger.post('/api/password-resets', { email: user.email });
    const token = new URL((await latestMailTo(user.email)).link!).searchParams.get('token')!;
    expect(
      (await stranger.post('/api/password-resets/complete', { token, password: 'a-reset-passphrase-31' })).status,
    ).toBe(204);
    expect((await first.get('/api/session')).status).toBe(401);
    expect((await second.get('/api/session')).status).toBe(401);
  });
});

describe('the absolute session lifetime', () => {
  it('when a session is older than seven days, then it is signed out however active it was', async () => {
    const { user, first } = await twoBrowsersOf();
    expect((await first.get('/api/session')).status).toBe(200);
    // Move this person's sign-in eight days back, as if the session had been kept alive since.
    await testApp.sequelize.query(
      `UPDATE sessions SET sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(:then::bigint))::json
       WHERE sess->'passport'->>'user' = :userId`,
      { replacements: { userId: user.id, then: Date.now() - 8 * 24 * 60 * 60_000 } },
    );
    const after = await first.get('/api/session');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('not_signed_in');
  });
});

describe('GET and DELETE /api/account/sessions', () => {
  it('when I list my sessions, then I see both browsers and can end the other one, not this one', async () => {
    const { first, second } = await twoBrowsersOf('researcher');
    const listed = await first.get('/api/account/sessions');
    expect(listed.status).toBe(200);
    expect(listed.body.items).toHaveLength(2);
    const current = listed.body.items.find((item: { current: boolean }) => item.current);
    const other = listed.body.items.find((item: { current: boolean }) => !item.current);
    expect(current.signedInAt).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    expect(other.ip).toMatch(/127\.0\.0\.1/);
    expect(JSON.stringify(listed.body)).not.toMatch(/sid|passport/);

    expect((await first.delete(`/api/account/sessions/${current.id}`)).status).toBe(409);
    expect((await first.delete(`/api/account/sessions/${other.id}`)).status).toBe(204);
    expect((await second.get('/api/session')).status).toBe(401);
    expect((await first.get('/api/session')).status).toBe(200);
    expect((await first.get('/api/account/sessions')).body.items).toHaveLength(1);
  });

  it("when someone names another person's session, then 404 and it goes on", async () => {
    const mine = await twoBrowsersOf();
    const theirs = await twoBrowsersOf();
    const theirIds = (await theirs.first.get('/api/account/sessions')).body.items.map(
      (item: { id: string }) => item.id,
    );
    for (const id of theirIds) expect((await mine.first.delete(`/api/account/sessions/${id}`)).status).toBe(404);
    expect((await theirs.second.get('/api/session')).status).toBe(200);
    expect((await mine.first.delete('/api/account/sessions')).status).toBe(204);
    expect((await mine.second.get('/api/session')).status).toBe(401);
    expect((await theirs.second.get('/api/session')).status).toBe(200);
  });
});
