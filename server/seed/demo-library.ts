import type { Transaction } from 'sequelize';
import { e00FromWavelength } from '@shared/engine';
import { Compound, ExcitedStateEnergy, ExcitedStateLifetime, RedoxPotential } from '../models';
import type { Lab } from '../models';

/*
 * The demo lab's compound library. Every code and number here is INVENTED for the demo
 * scenario (plausible magnitudes, no real compound). Potentials are entered against three
 * references (SCE, Fc+/Fc, Ag/AgCl) on purpose, so the screens show conversions and warnings.
 */

type Potential = [
  couple: 'oxidation' | 'reduction',
  value: number,
  reference: string,
  kind: 'half-wave' | 'half-peak' | 'peak',
];
interface DemoCompound {
  name: string;
  /** the plain words a title may use for it ("iridium emitter", "amine"); checked against demo titles */
  family: string;
  roleHint: 'photocatalyst' | 'quencher' | 'both';
  emissiveState?: string;
  tripletEnergy?: number;
  charge?: number;
  formula?: string;
  potentials: Potential[];
  /** s, under argon */
  lifetime?: number;
  /** eV, or { nm } entered as a wavelength */
  e00?: number | { nm: number };
}

const demoCompounds: DemoCompound[] = [
  {
    name: 'HL-Ir-7',
    family: 'iridium',
    roleHint: 'photocatalyst',
    emissiveState: 'MLCT',
    tripletEnergy: 2.6,
    charge: 1,
    potentials: [
      ['oxidation', 1.21, 'SCE', 'half-wave'],
      ['reduction', -1.71, 'Fc+/Fc', 'half-wave'],
    ],
    lifetime: 1.9e-6,
    e00: { nm: 475 },
  },
  {
    name: 'HL-Cz-2',
    family: 'carbazole',
    roleHint: 'photocatalyst',
    emissiveState: 'charge transfer',
    tripletEnergy: 2.48,
    formula: 'C56H32N6',
    potentials: [
      ['oxidation', 1.14, 'Fc+/Fc', 'half-wave'],
      ['reduction', -1.62, 'Fc+/Fc', 'half-wave'],
    ],
    lifetime: 4.6e-6,
    e00: 2.55,
  },
  {
    name: 'HL-Ru-4',
    family: 'ruthenium',
    roleHint: 'photocatalyst',
    emissiveState: 'MLCT',
    tripletEnergy: 2.05,
    charge: 2,
    potentials: [
      ['oxidation', 1.31, 'Ag/AgCl (sat. KCl)', 'half-wave'],
      ['reduction', -1.3, 'Ag/AgCl (sat. KCl)', 'half-wave'],
    ],
    lifetime: 9.5e-7,
    e00: 2.08,
  },
  {
    name: 'Q-amine-3',
    family: 'amine',
    roleHint: 'quencher',
    tripletEnergy: 3.1,
    potentials: [['oxidation', 0.71, 'SCE', 'half-peak']],
  },
  {
    name: 'Q-aryl-Br-1',
    family: 'aryl bromide',
    roleHint: 'quencher',
    tripletEnergy: 2.9,
    potentials: [['reduction', -2.05, 'Fc+/Fc', 'peak']],
  },
  {
    name: 'Q-viol-5',
    family: 'bipyridinium salt',
    roleHint: 'quencher',
    charge: 2,
    potentials: [['reduction', -0.83, 'Fc+/Fc', 'half-wave']],
  },
  {
    name: 'Q-ene-6',
    family: 'alkene',
    roleHint: 'both',
    tripletEnergy: 2.31,
    potentials: [
      ['oxidation', 1.95, 'SCE', 'peak'],
      ['reduction', -2.4, 'SCE', 'peak'],
    ],
  },
  {
    name: 'Q-thiol-8',
    family: 'thiol',
    roleHint: 'quencher',
    potentials: [['oxidation', 0.95, 'SCE', 'peak']],
  },
  {
    name: 'Q-borate-9',
    family: 'borate salt',
    roleHint: 'quencher',
    charge: -1,
    potentials: [['oxidation', 0.62, 'Fc+/Fc', 'half-peak']],
  },
];

/** Each demo compound's name and the plain words titles use for it (tests check titles with these). */
export const demoCompoundFamilies: ReadonlyArray<{ name: string; family: string }> = demoCompounds.map(
  ({ name, family }) => ({ name, family }),
);

/** Names the studies' demo data can look up (emitters first). */
export const demoEmitterNames = demoCompounds.filter((c) => c.roleHint === 'photocatalyst').map((c) => c.name);
export const demoQuencherNames = demoCompounds.filter((c) => c.roleHint !== 'photocatalyst').map((c) => c.name);

/** What the demo studies find by name: compound ids, and the lifetime record of each emitter. */
export interface DemoLibrary {
  compounds: Record<string, string>;
  lifetimes: Record<string, { id: string; value: number; uncertainty: number }>;
}

/** Seeds the Marram demo lab's library inside the demo transaction; returns its records by compound name. */
export async function seedDemoLibrary(transaction: Transaction, labs: Record<string, Lab>): Promise<DemoLibrary> {
  const lab = labs.marram;
  const ids: Record<string, string> = {};
  const lifetimes: DemoLibrary['lifetimes'] = {};
  if (!lab) return { compounds: ids, lifetimes };
  const demo = {
    labId: lab.id,
    createdById: null,
    source: 'Demo notebook HL-2026 (invented)',
    notes: 'Demo record: invented values.',
  };
  for (const item of demoCompounds) {
    const compound = await Compound.create(
      {
        labId: lab.id,
        createdById: null,
        name: item.name,
        roleHint: item.roleHint,
        emissiveState: item.emissiveState ?? null,
        tripletEnergy: item.tripletEnergy ?? null,
        tripletEnergySource: item.tripletEnergy ? 'Demo: invented 77 K phosphorescence onset' : null,
        charge: item.charge ?? 0,
        formula: item.formula ?? null,
        notes: 'Demo compound: invented code and numbers.',
      },
      { transaction },
    );
    ids[item.name] = compound.id;
    const compoundId = compound.id;
    for (const [couple, value, reference, kind] of item.potentials) {
      await RedoxPotential.create(
        { ...demo, compoundId, couple, value, reference, kind, solvent: 'acetonitrile', electrolyte: '0.1 M Bu4NPF6' },
        { transaction },
      );
    }
    if (item.lifetime) {
      const record = await ExcitedStateLifetime.create(
        {
          ...demo,
          compoundId,
          value: item.lifetime,
          uncertainty: item.lifetime * 0.03,
          solvent: 'acetonitrile',
          atmosphere: 'argon',
          temperature: 298.15,
          method: 'TCSPC',
        },
        { transaction },
      );
      lifetimes[item.name] = { id: record.id, value: record.value, uncertainty: record.uncertainty ?? 0 };
    }
    if (item.e00 !== undefined) {
      const fromWavelength = typeof item.e00 === 'object';
      await ExcitedStateEnergy.create(
        {
          ...demo,
          compoundId,
          value: fromWavelength ? e00FromWavelength((item.e00 as { nm: number }).nm) : (item.e00 as number),
          wavelength: fromWavelength ? (item.e00 as { nm: number }).nm : null,
          method: fromWavelength ? 'emission onset at 77 K' : 'absorption/emission crossing',
        },
        { transaction },
      );
    }
  }
  return { compounds: ids, lifetimes };
}
