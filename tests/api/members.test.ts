import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent, Invitation } from '../../server/models';
import { apiClient, createLabWithMembers, latestMailTo } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

const tokenOf = (link: string | null) => link!.split('/invitations/')[1]!;

async function adminOfNewLab(roles: Array<'viewer' | 'researcher' | 'reviewer' | 'admin'> = ['admin']) {
  const setup = await createLabWithMembers(testApp.sequelize, { roles });
  const admin = await apiClient(testApp.app);
  await admin.signIn(setup.users.admin);
  return { ...setup, admin };
}

describe('POST /api/labs/:labId/invitations', () => {
  it('when a new address is invited, then the mailed link lets the person join with the role, once', async () => {
    const { lab, admin, users } = await adminOfNewLab();
    const email = `new-${Date.now()}@tests.halflight.example`;
    const invited = await admin.post(`/api/labs/${lab.id}/invitations`, { email, role: 'reviewer' });
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email, role: 'reviewer', invitedBy: users.admin.name });
    const { mail, link } = await latestMailTo(email);
    expect(mail?.labId).toBe(lab.id);
    expect(mail?.subject).toBe(`Join ${lab.name} on Halflight`);

    const guest = await apiClient(testApp.app);
    const preview = await guest.get(`/api/invitations/${tokenOf(link)}`);
    expect(preview.body).toMatchObject({ labName: lab.name, role: 'reviewer', email, accountExists: false });
    const missingName = await guest.post(`/api/invitations/${tokenOf(link)}/accept`, {
      password: 'newcomer-passphrase',
    });
    expect(missingName.status).toBe(400);
    expect(missingName.body.error.details).toEqual([{ path: 'body.name', message: 'is required' }]);
    const accepted = await guest.post(`/api/invitations/${tokenOf(link)}/accept`, {
      name: 'New Person',
      password: 'newcomer-passphrase',
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.labs).toEqual([
      { labId: lab.id, labName: lab.name, isDemo: false, role: 'reviewer', requireTwoFactor: false },
    ]);
    expect((await guest.get('/api/session')).body.user.email).toBe(email);

    const reused = await apiClient(testApp.app);
    const again = await reused.post(`/api/invitations/${tokenOf(link)}/accept`, {
      name: 'Someone Else',
      password: 'other-passphrase',
    });
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('invitation_invalid');
    const audit = await AuditEvent.findOne({ where: { action: 'membership_added', labId: lab.id } });
    expect(audit?.details).toMatchObject({ role: 'reviewer', via: 'invitation' });
  });

  it('when the person already has an account, then they join by proving their password', async () => {
    const { lab, admin } = await adminOfNewLab();
    const elsewhere = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const person = elsewhere.users.researcher;
    await admin.post(`/api/labs/${lab.id}/invitations`, { email: person.email, role: 'viewer' });
    const { link } = await latestMailTo(person.email);
    const client = await apiClient(testApp.app);
    expect((await client.get(`/api/invitations/${tokenOf(link)}`)).body.accountExists).toBe(true);
    const wrong = await client.post(`/api/invitations/${tokenOf(link)}/accept`, { password: 'not-their-password' });
    expect(wrong.status).toBe(401);
    const joined = await client.post(`/api/invitations/${tokenOf(link)}/accept`, { password: person.password });
    expect(joined.body.user.labs.map((entry: { role: string }) => entry.role).sort()).toEqual(['researcher', 'viewer']);
  });

  it('when an invitation expired or was revoked, then its link no longer works', async () => {
    const { lab, admin } = await adminOfNewLab();
    const expiring = `late-${Date.now()}@tests.halflight.example`;
    await admin.post(`/api/labs/${lab.id}/invitations`, { email: expiring, role: 'viewer' });
    const expiredLink = (await latestMailTo(expiring)).link;
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: expiring } });
    const guest = await apiClient(testApp.app);
    expect((await guest.get(`/api/invitations/${tokenOf(expiredLink)}`)).status).toBe(404);

    const revoking = `revoked-${Date.now()}@tests.halflight.example`;
    const created = await admin.post(`/api/labs/${lab.id}/invitations`, { email: revoking, role: 'viewer' });
    const list = await admin.get(`/api/labs/${lab.id}/members`);
    expect(list.body.invitations.map((item: { email: string }) => item.email)).toEqual([revoking]);
    const revokedLink = (await latestMailTo(revoking)).link;
    expect((await admin.delete(`/api/labs/${lab.id}/invitations/${created.body.id}`)).status).toBe(204);
    const accept = await guest.post(`/api/invitations/${tokenOf(revokedLink)}/accept`, {
      name: 'Too Late',
      password: 'too-late-passphrase',
    });
    expect(accept.status).toBe(404);
  });

  it('when the address is already a member or invited, then 409 says so', async () => {
    const { lab, admin, users } = await adminOfNewLab(['admin', 'viewer']);
    const member = await admin.post(`/api/labs/${lab.id}/invitations`, { email: users.viewer.email, role: 'admin' });
    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe('already_member');
    const email = `twice-${Date.now()}@tests.halflight.example`;
    await admin.post(`/api/labs/${lab.id}/invitations`, { email, role: 'viewer' });
    expect((await admin.post(`/api/labs/${lab.id}/invitations`, { email, role: 'viewer' })).body.error.code).toBe(
      'already_invited',
    );
  });
});

describe('PATCH and DELETE /api/labs/:labId/members/:memberId', () => {
  it('when the only admin would be demoted or removed, then 409 last_admin and the role stays', async () => {
    const { lab, admin, memberships } = await adminOfNewLab(['admin', 'researcher']);
    const demote = await admin.patch(`/api/labs/${lab.id}/members/${memberships.admin}`, { role: 'reviewer' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_admin');
    expect((await admin.delete(`/api/labs/${lab.id}/members/${memberships.admin}`)).status).toBe(409);
    const members = (await admin.get(`/api/labs/${lab.id}/members`)).body.members;
    expect(members.find((member: { id: string }) => member.id === memberships.admin).role).toBe('admin');
  });

  it('when a second admin exists, then the first can step down, and roles change with an audit trail', async () => {
    const { lab, admin, memberships, users } = await adminOfNewLab(['admin', 'researcher']);
    const promoted = await admin.patch(`/api/labs/${lab.id}/members/${memberships.researcher}`, { role: 'admin' });
    expect(promoted.body.role).toBe('admin');
    expect((await admin.patch(`/api/labs/${lab.id}/members/${memberships.admin}`, { role: 'viewer' })).status).toBe(
      200,
    );
    const forbidden = await admin.delete(`/api/labs/${lab.id}/members/${memberships.researcher}`);
    expect(forbidden.status).toBe(403);
    const changes = await AuditEvent.findAll({
      where: { action: 'role_changed', labId: lab.id },
      order: [['id', 'ASC']],
    });
    expect(changes.map((event) => event.details)).toEqual([
      { userId: users.researcher.id, from: 'researcher', to: 'admin' },
      { userId: users.admin.id, from: 'admin', to: 'viewer' },
    ]);
  });

  it('when an admin removes a member, then that person loses access to the lab at once', async () => {
    const { lab, admin, memberships, users } = await adminOfNewLab(['admin', 'viewer']);
    const viewer = await apiClient(testApp.app);
    await viewer.signIn(users.viewer);
    expect((await viewer.get(`/api/labs/${lab.id}/members`)).status).toBe(200);
    expect((await admin.delete(`/api/labs/${lab.id}/members/${memberships.viewer}`)).status).toBe(204);
    expect((await viewer.get(`/api/labs/${lab.id}/members`)).status).toBe(404);
  });
});
