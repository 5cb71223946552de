import { z } from 'zod';
import { mechanismVerdictSchema } from './mechanism-evidence';

export const comparisonParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  side: z.enum(['emitter', 'quencher']).describe('emitter: every quencher studied against it; quencher: every emitter'),
  compoundId: z.string().uuid('must be a compound id'),
});

export const comparisonQuerySchema = z.object({
  approvedOnly: z
    .enum(['true', 'false'])
    .default('false')
    .transform((value) => value === 'true')
    .describe('fit the trend to approved results only'),
  sort: z.enum(['kq', 'kSv', 'drivingForce', 'partner']).default('kq'),
});

const estimate = z.object({ value: z.number(), standardError: z.number().nullable() });

const diffusionLimitSchema = z.object({
  value: z.number().describe('k_diff = 8RT/(3 eta(T)), M^-1 s^-1'),
  basis: z.string().describe('where eta(T) comes from'),
  note: z.string().nullable().describe('e.g. the temperature is outside the correlation range'),
});

export const comparisonRowSchema = z.object({
  studyId: z.string(),
  title: z.string(),
  partner: z.object({ id: z.string(), name: z.string() }).describe('the quencher (or emitter) on the other side'),
  solvent: z.string().describe('engine solvent id, or the custom solvent name'),
  status: z.enum(['draft', 'submitted', 'approved', 'returned']),
  kq: estimate.nullable().describe('M^-1 s^-1'),
  kSv: estimate.nullable().describe('M^-1'),
  flags: z.array(z.object({ code: z.string(), title: z.string() })),
  drivingForce: z
    .object({ pathway: z.enum(['oxidative', 'reductive']), electronvolts: z.number(), withWorkTerm: z.number() })
    .nullable()
    .describe('the highlighted pathway (pinned, else the more favourable), eV'),
  drivingForceMissing: z.string().nullable().describe('why there is no driving force, when there is none'),
  // The combined verdict of the study's mechanism evidence (GET .../studies/:studyId/mechanism).
  mechanism: mechanismVerdictSchema,
  temperature: z.number().describe('the study temperature, K'),
  diffusionLimit: diffusionLimitSchema
    .nullable()
    .describe('k_diff at the study temperature; null for a custom solvent without an entered viscosity'),
});

export const trendSchema = z.object({
  solvent: z.string(),
  temperature: z.number().describe('K: studies at different temperatures are never fitted together'),
  label: z.string().describe('solvent and temperature, for legends'),
  diffusionLimit: z.number().nullable().describe('k_d at this temperature, M^-1 s^-1'),
  diffusionBasis: z.string().nullable().describe('where eta(T) of k_d comes from'),
  points: z.array(
    z.object({ studyId: z.string(), drivingForce: z.number(), log10Kq: z.number(), approved: z.boolean() }),
  ),
  fit: z
    .object({
      reorganisationEnergy: z.number().describe('lambda, eV'),
      reorganisationEnergyStandardError: z.number(),
      kdOverKZ: z.number(),
      residualStandardDeviation: z.number().describe('log10 units'),
      n: z.number().int(),
      curve: z.array(z.object({ drivingForce: z.number(), log10Kq: z.number() })),
    })
    .nullable(),
  note: z.string().nullable().describe('why no fit was made, when none was'),
});

export const comparisonSchema = z
  .object({
    side: z.enum(['emitter', 'quencher']),
    compound: z.object({ id: z.string(), name: z.string() }),
    rows: z.array(comparisonRowSchema),
    trends: z
      .array(trendSchema)
      .describe(
        'one per solvent and temperature: studies in different solvents or at different temperatures are never fitted together',
      ),
    engineVersion: z.string(),
  })
  .meta({ id: 'Comparison' });

export type Comparison = z.infer<typeof comparisonSchema>;
export type ComparisonRow = z.infer<typeof comparisonRowSchema>;
export type Trend = z.infer<typeof trendSchema>;
