import { afterAll, describe, expect, it } from 'vitest';
import { Lab, Membership, User } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { ensureFirstAdmin } from '../../server/services/first-admin.service';
import { apiClient } from '../support/accounts';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

describe('ensureFirstAdmin', () => {
  it('when the first-admin settings are given, then one lab and its admin are made once, and they can sign in', async () => {
    const email = `first-${Date.now()}@tests.halflight.example`;
    const input = { email, password: 'first-admin-passphrase', labName: 'Photophysics Core' };
    expect(await ensureFirstAdmin(testApp.sequelize, input)).toEqual({ created: true });
    expect(await ensureFirstAdmin(testApp.sequelize, input)).toEqual({ created: false });
    const client = await apiClient(testApp.app);
    const session = await client.signIn({ email, password: input.password });
    expect(session.body.user.labs).toEqual([expect.objectContaining({ labName: 'Photophysics Core', role: 'admin' })]);
  });
});

describe('seedDemoData', () => {
  it('when run twice, then the invented demo labs and people exist once, each person with their roles', async () => {
    await seedDemoData(testApp.sequelize);
    expect(await seedDemoData(testApp.sequelize)).toEqual({ created: false });
    for (const lab of demoLabs) {
      expect(await Lab.count({ where: { slug: lab.slug, isDemo: true } })).toBe(1);
    }
    const lead = demoPeople[0]!;
    const user = await User.findOne({ where: { email: lead.email } });
    expect(await Membership.count({ where: { userId: user!.id } })).toBe(Object.keys(lead.roles).length);
    const client = await apiClient(testApp.app);
    const session = await client.signIn({ email: lead.email, password: demoPassword });
    expect(session.body.user.labs.every((lab: { isDemo: boolean }) => lab.isDemo)).toBe(true);
  });
});
