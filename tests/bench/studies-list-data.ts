import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { Compound, Lab, Study, User } from '../../server/models';

/** Deterministic pseudo-random numbers (mulberry32), so every run inserts the same invented rows. */
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SOLVENTS = ['acetonitrile', 'dichloromethane', 'dmf', 'dmso', 'methanol', 'toluene'];
const STATUSES = ['draft', 'draft', 'submitted', 'approved', 'approved', 'returned'] as const;
const NOTE_WORDS = [
  'amine screen',
  'sulfide series',
  'thiophenol',
  'borate salt',
  'aryl halide',
  'enamine',
  'silicate',
];

/**
 * Invented studies for the list benchmark: `inLab` in the measured lab (20 emitters, 60
 * quenchers, 8 owners, 6 solvents) and `elsewhere` in a second lab; bulk inserts in chunks,
 * updated_at spread over a year, then ANALYZE so the planner sees the real distribution.
 */
export async function seedBenchStudies(
  sequelize: Sequelize,
  inLab = 10_000,
  elsewhere = 1_000,
): Promise<{ labId: string; ownerId: string; emitterId: string; quencherId: string; inLab: number; total: number }> {
  const random = seeded(20260301);
  const pick = <T>(items: readonly T[]) => items[Math.floor(random() * items.length)]!;
  const [lab, other] = await Lab.bulkCreate([
    { name: 'Bench lab (invented)', slug: 'bench-lab' },
    { name: 'Other bench lab (invented)', slug: 'bench-other' },
  ]);
  const owners = await User.bulkCreate(
    Array.from({ length: 8 }, (_, i) => ({
      email: `bench-${i}@example.invalid`,
      name: `Bench person ${i + 1}`,
      passwordHash: 'not-a-login',
    })),
  );
  const compoundsOf = (labId: string, prefix: string, count: number, roleHint: 'photocatalyst' | 'quencher') =>
    Compound.bulkCreate(Array.from({ length: count }, (_, i) => ({ labId, name: `${prefix}-${i + 1}`, roleHint })));
  const rowsFor = async (labId: string, count: number) => {
    const emitters = await compoundsOf(labId, 'HL-Ir', 20, 'photocatalyst');
    const quenchers = await compoundsOf(labId, 'HL-Q', 60, 'quencher');
    const rows = Array.from({ length: count }, (_, i) => {
      const fitted = random() > 0.1;
      const kSv = fitted ? 10 ** (1 + 3 * random()) : null;
      return {
        id: crypto.randomUUID(),
        labId,
        emitterId: pick(emitters).id,
        quencherId: pick(quenchers).id,
        ownerId: pick(owners).id,
        title: `Bench titration ${i + 1} (invented)`,
        notes: `${pick(NOTE_WORDS)} run ${Math.floor(random() * 900) + 100}`,
        solventId: pick(SOLVENTS),
        customSolventName: null,
        customViscosity: null,
        temperature: 298.15,
        excitationWavelength: 450,
        emissionWavelength: 600,
        windowStart: null,
        windowEnd: null,
        atmosphere: 'argon',
        degassingMethod: 'sparging',
        tau0: 1e-6,
        tau0Uncertainty: null,
        tau0LifetimeId: null,
        i0: null,
        dataKind: 'intensity' as const,
        fitModel: 'linear-free' as const,
        fitWeighting: 'unweighted' as const,
        dilutionCorrection: false,
        initialVolume: null,
        stockConcentration: null,
        stockContainsEmitter: false,
        innerFilterCorrection: false,
        pinnedMechanism: null,
        previousRevisionId: null,
        status: pick(STATUSES),
        kSv,
        kq: kSv === null ? null : kSv / 1e-6,
        flagged: random() < 0.15,
      };
    });
    for (let start = 0; start < rows.length; start += 2000)
      await Study.bulkCreate(rows.slice(start, start + 2000), { validate: false, hooks: false });
    return { emitterId: emitters[0]!.id, quencherId: quenchers[0]!.id };
  };
  const measured = await rowsFor(lab!.id, inLab);
  await rowsFor(other!.id, elsewhere);
  await sequelize.query("UPDATE studies SET updated_at = now() - random() * interval '365 days'");
  await sequelize.query('ANALYZE studies');
  return { labId: lab!.id, ownerId: owners[0]!.id, ...measured, inLab, total: inLab + elsewhere };
}
