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
    roleHint: 'quencher',
    tripletEnergy: 3.1,
    potentials: [['oxidation', 0.71, 'SCE', 'half-peak']],
  },
  {
    name: 'Q-aryl-Br-1',
    roleHint: 'quencher',
    tripletEnergy: 2.9,
    potentials: [['reduction', -2.05, 'Fc+/Fc', 'peak']],
  },
  { name: 'Q-viol-5', roleHint: 'quencher', charge: 2, potentials: [['reduction', -0.83, 'Fc+/Fc', 'half-wave']] },
  {
    name: 'Q-ene-6',
    roleHint: 'both',
    tripletEnergy: 2.31,
    potentials: [
      ['oxidation', 1.95, 'SCE', 'peak'],
      ['reduction', -2.4, 'SCE', 'peak'],
    ],
  },
];

/** Names the studies' demo data can look up (emitters first). */
export const demoEmitterNames = demoCompounds.filter((c) => c.roleHint === 'photocatalyst').map((c) => c.name);
export const demoQuencherNames = demoCompounds.filter((c) => c.roleHint !== 'photocatalyst').map((c) => c.name);

/** Seeds the Marram demo lab's library inside the demo transaction; returns compound ids by name. */
export async function seedDemoLibrary(
  transaction: Transaction,
  labs: Record<string, Lab>,
): Promise<Record<string, string>> {
  const lab = labs.marram;
  if (!lab) return {};
  const ids: Record<string, string> = {};
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
      await ExcitedStateLifetime.create(
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
  return ids;
}
