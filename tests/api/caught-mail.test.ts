import fs from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { Membership } from '../../server/models';
import { apiClient, createLabWithMembers, settleMailQueue } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

interface Listed {
  to: string[];
  subject: string;
  text: string;
}

describe('GET /api/caught-mail', () => {
  it('when the admin of one lab asks a reset for the admin of another lab, then the link is readable only by its addressee (no takeover)', async () => {
    // Two labs; the victim is a viewer in the attacker's lab and the admin of their own.
    const attackerLab = await createLabWithMembers(testApp.sequelize, { roles: ['admin'] });
    const victimLab = await createLabWithMembers(testApp.sequelize, { roles: ['admin'] });
    const victim = victimLab.users.admin;
    await Membership.create({ labId: attackerLab.lab.id, userId: victim.id, role: 'viewer' });

    const attacker = await apiClient(testApp.app);
    await attacker.signIn(attackerLab.users.admin);
    expect((await attacker.post('/api/password-resets', { email: victim.email })).status).toBe(202);
    await settleMailQueue();

    // Every way the attacker could read caught mail shows no reset link for the victim.
    const readable: Listed[] = [];
    for (const url of ['/api/caught-mail', `/api/labs/${attackerLab.lab.id}/caught-mail`]) {
      const response = await attacker.get(url);
      if (response.status === 200) readable.push(...(response.body.items as Listed[]));
    }
    expect(readable.filter((mail) => mail.to.includes(victim.email))).toEqual([]);
    expect(readable.some((mail) => /reset-password\?token=/.test(mail.text))).toBe(false);

    // The victim reads their own link.
    const owner = await apiClient(testApp.app);
    await owner.signIn(victim);
    const mine = (await owner.get('/api/caught-mail')).body.items as Listed[];
    expect(mine.map((mail) => mail.subject)).toContain('Set a new Halflight password');
  });

  it('when an admin invites someone, then the admin sees that invitation and other admins of the lab do not', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['admin', 'reviewer'] });
    const second = await createLabWithMembers(testApp.sequelize, { roles: ['admin'] });
    await Membership.create({ labId: lab.id, userId: second.users.admin.id, role: 'admin' });
    const inviter = await apiClient(testApp.app);
    await inviter.signIn(users.admin);
    const email = `invited-${Date.now()}@tests.halflight.example`;
    expect((await inviter.post(`/api/labs/${lab.id}/invitations`, { email, role: 'viewer' })).status).toBe(201);
    await settleMailQueue();

    const sent = (await inviter.get('/api/caught-mail')).body.items as Listed[];
    expect(sent.filter((mail) => mail.to.includes(email)).map((mail) => mail.subject)).toEqual([
      `Join ${lab.name} on Halflight`,
    ]);
    const otherAdmin = await apiClient(testApp.app);
    await otherAdmin.signIn(second.users.admin);
    expect(((await otherAdmin.get('/api/caught-mail')).body.items as Listed[]).some((m) => m.to.includes(email))).toBe(
      false,
    );
    const reviewer = await apiClient(testApp.app);
    await reviewer.signIn(users.reviewer);
    expect(((await reviewer.get('/api/caught-mail')).body.items as Listed[]).some((m) => m.to.includes(email))).toBe(
      false,
    );
  });

  it('when the catcher takes a message, then it also writes an .eml file under its folder', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['viewer'] });
    const client = await apiClient(testApp.app);
    await client.post('/api/password-resets', { email: users.viewer.email });
    await settleMailQueue();
    const files = fs.readdirSync(testApp.caughtMailDir).filter((name) => name.endsWith('.eml'));
    const contents = files.map((name) => fs.readFileSync(`${testApp.caughtMailDir}/${name}`, 'utf8'));
    const ours = contents.find((text) => text.includes(users.viewer.email));
    expect(ours).toMatch(/^Subject: Set a new Halflight password$/m);
    expect(ours).toContain('reset-password?token=');
  });
});
