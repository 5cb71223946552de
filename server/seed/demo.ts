import type { Sequelize } from 'sequelize';
import type { Role } from '@shared/schemas/roles';
import { hashPassword } from '../auth/passwords';
import { Lab, Membership, User } from '../models';
import { startDemoClock } from './demo-clock';
import { demoCompoundFamilies, seedDemoLibrary } from './demo-library';
import { seedDemoStudies } from './demo-studies';

/** The invented demo scenario. Every name, address and number in it is made up. */
export const demoLabs = [
  { key: 'marram', name: 'Demo — Marram Photoredox Group', slug: 'demo-marram' },
  { key: 'saltmarsh', name: 'Demo — Saltmarsh Materials Lab', slug: 'demo-saltmarsh' },
] as const;

/** Demo sign-ins, listed in the README as demo-only. */
export const demoPassword = 'halflight-demo';
export const demoPeople: Array<{
  key: 'ines' | 'tomasz' | 'priya' | 'jonah';
  email: string;
  name: string;
  roles: Partial<Record<'marram' | 'saltmarsh', Role>>;
}> = [
  {
    key: 'ines',
    email: 'ines.okafor@demo.halflight.example',
    name: 'Ines Okafor',
    roles: { marram: 'admin', saltmarsh: 'researcher' },
  },
  { key: 'tomasz', email: 'tomasz.wren@demo.halflight.example', name: 'Tomasz Wren', roles: { marram: 'reviewer' } },
  {
    key: 'priya',
    email: 'priya.halvorsen@demo.halflight.example',
    name: 'Priya Halvorsen',
    roles: { marram: 'researcher' },
  },
  {
    key: 'jonah',
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
    const clock = startDemoClock(transaction);
    try {
      const labs: Record<string, Lab> = {};
      const people = {} as Record<(typeof demoPeople)[number]['key'], User>;
      for (const lab of demoLabs) {
        labs[lab.key] = await Lab.create({ name: lab.name, slug: lab.slug, isDemo: true }, { transaction });
      }
      clock.set(40, 9);
      for (const person of demoPeople) {
        const user = await User.create({ email: person.email, name: person.name, passwordHash }, { transaction });
        people[person.key] = user;
        for (const [labKey, role] of Object.entries(person.roles)) {
          const membership = await Membership.create(
            { labId: labs[labKey]!.id, userId: user.id, role },
            { transaction },
          );
          clock.record(
            { userId: user.id, ip: null },
            'membership_added',
            labs[labKey]!.id,
            membership.id,
            { role },
            'membership',
          );
        }
      }
      clock.set(30, 10);
      const library = await seedDemoLibrary(transaction, labs);
      if (labs.marram) {
        // The library was filled over a few days, by the lab's admin and its reviewer.
        demoCompoundFamilies.forEach(({ name }, index) => {
          clock.set(30 - Math.floor(index / 3), 9 + (index % 3));
          const by = index % 2 === 0 ? people.ines : people.tomasz;
          const compoundId = library.compounds[name];
          if (compoundId)
            clock.record(
              { userId: by.id, ip: null },
              'compound_added',
              labs.marram!.id,
              compoundId,
              { name },
              'compound',
            );
        });
        await seedDemoStudies(transaction, labs, people, library, clock);
      }
      await clock.flush();
      return { created: true };
    } finally {
      clock.stop();
    }
  });
}
