import type { Sequelize } from 'sequelize';
import type { Role } from '@shared/schemas/roles';
import { hashPassword } from '../auth/passwords';
import { Lab, Membership, User } from '../models';
import { seedDemoStudies } from './demo-studies';
import { seedDemoLibrary } from './demo-library';

/** The invented demo scenario. Every name, address and number in it is made up. */
export const demoLabs = [
  { key: 'marram', name: 'Demo — Marram Photoredox Group', slug: 'demo-marram' },
  { key: 'saltmarsh', name: 'Demo — Saltmarsh Materials Lab', slug: 'demo-saltmarsh' },
] as const;

/** Demo sign-ins, listed in the README as demo-only. */
export const demoPassword = 'halflight-demo';
export const demoPeople: Array<{ email: string; name: string; roles: Partial<Record<'marram' | 'saltmarsh', Role>> }> =
  [
    {
      email: 'ines.okafor@demo.halflight.example',
      name: 'Ines Okafor',
      roles: { marram: 'admin', saltmarsh: 'researcher' },
    },
    { email: 'tomasz.wren@demo.halflight.example', name: 'Tomasz Wren', roles: { marram: 'reviewer' } },
    { email: 'priya.halvorsen@demo.halflight.example', name: 'Priya Halvorsen', roles: { marram: 'researcher' } },
    {
      email: 'jonah.mbeki@demo.halflight.example',
      name: 'Jonah Mbeki',
      roles: { marram: 'viewer', saltmarsh: 'admin' },
    },
  ];

/**
 * Loads the demo scenario once, on a database without it. Later features add their records
 * here; everything runs in one transaction, so a failed seed leaves nothing half-made.
 */
export async function seedDemoData(sequelize: Sequelize): Promise<{ created: boolean }> {
  if (await Lab.count({ where: { slug: demoLabs[0].slug } })) return { created: false };
  const passwordHash = await hashPassword(demoPassword);
  return sequelize.transaction(async (transaction) => {
    const labs: Record<string, Lab> = {};
    const users: Record<string, User> = {};
    for (const lab of demoLabs) {
      labs[lab.key] = await Lab.create({ name: lab.name, slug: lab.slug, isDemo: true }, { transaction });
    }
    for (const person of demoPeople) {
      const user = await User.create({ email: person.email, name: person.name, passwordHash }, { transaction });
      users[person.email] = user;
      for (const [labKey, role] of Object.entries(person.roles)) {
        await Membership.create({ labId: labs[labKey]!.id, userId: user.id, role }, { transaction });
      }
    }
    await seedDemoLibrary(transaction, labs);
    await seedDemoStudies(transaction, labs, users);
    return { created: true };
  });
}
