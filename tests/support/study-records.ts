import { Compound, Study } from '../../server/models';

/** A compound of the lab (test data). */
export function createCompound(labId: string, name: string, roleHint: 'photocatalyst' | 'quencher' | 'both') {
  return Compound.create({ labId, name, roleHint, createdById: null });
}

/**
 * A study row with a kq already fitted, for features that read results (scenarios, comparisons).
 * The kq and tau0 values are test inputs, not measurements.
 */
export function createStudyRecord(input: {
  labId: string;
  emitterId: string;
  quencherId: string;
  ownerId?: string | null;
  title?: string;
  kq?: number | null;
  kSv?: number | null;
  status?: 'draft' | 'submitted' | 'approved' | 'returned';
  solventId?: string;
  /** K, default 298.15 */
  temperature?: number;
}) {
  return Study.create({
    labId: input.labId,
    emitterId: input.emitterId,
    quencherId: input.quencherId,
    title: input.title ?? 'Test study',
    solventId: input.solventId ?? 'acetonitrile',
    customSolventName: null,
    customViscosity: null,
    temperature: input.temperature ?? 298.15,
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
    dataKind: 'intensity',
    fitModel: 'linear-free',
    fitWeighting: 'unweighted',
    dilutionCorrection: false,
    initialVolume: null,
    stockConcentration: null,
    stockContainsEmitter: false,
    innerFilterCorrection: false,
    pinnedMechanism: null,
    notes: '',
    ownerId: input.ownerId ?? null,
    status: input.status ?? 'draft',
    previousRevisionId: null,
    kq: input.kq ?? null,
    kSv: input.kSv ?? (input.kq ? input.kq * 1e-6 : null),
  });
}
