import { afterAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { PasswordReset, User } from '../../server/models';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

const tokenOf = (link: string | null) => new URL(link!).searchParams.get('token')!;

describe('POST /api/password-resets', () => {
  it('when the address has an account, then a one-hour link is mailed, works once, and the new password signs in', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    const asked = await client.post('/api/password-resets', { email: users.researcher.email.toUpperCase() });
    expect(asked.status).toBe(202);
    const { mail, link } = await latestMailTo(users.researcher.email);
    expect(mail?.subject).toBe('Set a new Halflight password');
    expect(link).toMatch(/^http:\/\/127\.0\.0\.1:4310\/reset-password\?token=/);
    const stored = await PasswordReset.findOne({ where: { userId: users.researcher.id } });
    // Only the hash is stored: the token itself never appears in the database.
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored!.tokenHash).not.toBe(tokenOf(link));
    expect(stored!.expiresAt.getTime() - Date.now()).toBeGreaterThan(59 * 60_000);
    expect(stored!.expiresAt.getTime() - Date.now()).toBeLessThanOrEqual(60 * 60_000);

    const newPassword = 'a-brand-new-passphrase';
    expect(
      (await client.post('/api/password-resets/complete', { token: tokenOf(link), password: newPassword })).status,
    ).toBe(204);
    const reused = await client.post('/api/password-resets/complete', {
      token: tokenOf(link),
      password: 'another-passphrase',
    });
    expect(reused.status).toBe(400);
    expect(reused.body.error.code).toBe('token_invalid');
    await client.signIn({ email: users.researcher.email, password: newPassword });
  });

  it('when the address has no account, then the answer is the same and no mail goes out', async () => {
    const client = await apiClient(testApp.app);
    const response = await client.post('/api/password-resets', { email: 'ghost@tests.halflight.example' });
    expect(response.status).toBe(202);
    expect(response.body.message).toMatch(/If this address has a Halflight account/);
    expect((await latestMailTo('ghost@tests.halflight.example')).mail).toBeNull();
  });

  it('when the link has expired, then it is refused and the old password still works', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.post('/api/password-resets', { email: users.viewer.email });
    const { link } = await latestMailTo(users.viewer.email);
    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: users.viewer.id } });
    const response = await client.post('/api/password-resets/complete', {
      token: tokenOf(link),
      password: 'too-late-passphrase',
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('token_invalid');
    await client.signIn(users.viewer);
  });
});

describe('POST /api/account/password', () => {
  it('when the current password is wrong, then 400 names that field and nothing changes', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const wrong = await client.post('/api/account/password', {
      currentPassword: 'nope',
      newPassword: 'long-enough-passphrase',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details).toEqual([{ path: 'body.currentPassword', message: 'is not right' }]);
    const short = await client.post('/api/account/password', {
      currentPassword: users.viewer.password,
      newPassword: 'short',
    });
    expect(short.body.error.details).toEqual([{ path: 'body.newPassword', message: 'must be at least 12 characters' }]);
    const ok = await client.post('/api/account/password', {
      currentPassword: users.viewer.password,
      newPassword: 'long-enough-passphrase',
    });
    expect(ok.status).toBe(200);
    const again = await apiClient(testApp.app);
    await again.signIn({ email: users.viewer.email, password: 'long-enough-passphrase' });
  });
});

describe('PATCH /api/account', () => {
  it('when the name changes, then the session shows the new name', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    expect((await client.patch('/api/account', { name: '  Dr. R. Example  ' })).body.name).toBe('Dr. R. Example');
    expect((await client.get('/api/session')).body.user.name).toBe('Dr. R. Example');
  });
});

describe('password rules', () => {
  it('when a new password is short or common, then 400 names the field and says why', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const change = (newPassword: string) =>
      client.post('/api/account/password', { currentPassword: users.viewer.password, newPassword });
    const short = await change('password12');
    expect(short.status).toBe(400);
    expect(short.body.error.details).toEqual([{ path: 'body.newPassword', message: 'must be at least 12 characters' }]);
    for (const common of ['password1234', '123456789012', 'qwertyuiop123']) {
      const refused = await change(common);
      expect(refused.status, common).toBe(400);
      expect(refused.body.error.code).toBe('weak_password');
      expect(refused.body.error.details[0].path).toBe('body.newPassword');
      expect(refused.body.error.details[0].message).toMatch(/^is too easy to guess: /);
    }
  });

  it('when the password has 100 characters, then exactly those 100 sign in, and no prefix or variant does', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.viewer);
    const long = 'amber-heron-quiet-lantern-'.repeat(4).slice(0, 99) + 'Z';
    expect(long).toHaveLength(100);
    expect(
      (await client.post('/api/account/password', { currentPassword: users.viewer.password, newPassword: long }))
        .status,
    ).toBe(200);
    const attempt = async (password: string) =>
      (await (await apiClient(testApp.app)).post('/api/session', { email: users.viewer.email, password })).status;
    expect(await attempt(long)).toBe(200);
    expect(await attempt(long.slice(0, 99))).toBe(401);
    expect(await attempt(long.slice(0, 99) + 'Y')).toBe(401);
    // bcrypt read only the first 72 bytes: any 73rd character used to pass.
    expect(await attempt(long.slice(0, 72))).toBe(401);
    expect(await attempt(long.slice(0, 72) + 'x')).toBe(401);
  });

  it('when an account still has a bcrypt hash, then the right password signs in and the hash becomes scrypt', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const legacy = await bcrypt.hash(users.viewer.password, 10);
    await User.update({ passwordHash: legacy }, { where: { id: users.viewer.id } });
    const wrong = await (
      await apiClient(testApp.app)
    ).post('/api/session', { ...users.viewer, password: 'not-it-at-all' });
    expect(wrong.status).toBe(401);
    expect((await User.findByPk(users.viewer.id))!.passwordHash).toBe(legacy);
    await (await apiClient(testApp.app)).signIn(users.viewer);
    const stored = (await User.findByPk(users.viewer.id))!.passwordHash;
    expect(stored).toMatch(/^scrypt\$16\$8\$1\$/);
    await (await apiClient(testApp.app)).signIn(users.viewer);
  });
});
