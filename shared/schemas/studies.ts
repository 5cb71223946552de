import { z } from 'zod';
import { SOLVENTS } from '../engine/kinetics/solvents';
import { labParamsSchema } from './members';

/** Study records (docs/product.md, section 3.2). Units: mol/L, s, L, Pa s, K; wavelengths in nm. */
export const studyStatuses = ['draft', 'submitted', 'approved', 'returned'] as const;
export const studyStatusSchema = z.enum(studyStatuses).meta({ id: 'StudyStatus' });
export type StudyStatus = z.infer<typeof studyStatusSchema>;

export const studyAtmospheres = ['argon', 'nitrogen', 'air', 'oxygen', 'vacuum', 'other'] as const;
export const degassingMethods = ['none', 'sparging', 'freeze-pump-thaw', 'glovebox', 'other'] as const;
export const fitModels = ['linear-free', 'linear-fixed', 'static-dynamic', 'modified'] as const;
export const fitModelSchema = z.enum(fitModels).meta({
  id: 'FitModel',
  description:
    'Stern–Volmer model: free or fixed intercept line, combined static+dynamic, modified (accessible fraction)',
});
export type FitModel = z.infer<typeof fitModelSchema>;
/** Each model in words, for people: the screens and the PDF report (never the stored key). */
export const fitModelNames = {
  'linear-free': 'Straight line, free intercept',
  'linear-fixed': 'Straight line through 1',
  'static-dynamic': 'Static + dynamic (quadratic)',
  modified: 'Accessible fraction (modified plot)',
} as const satisfies Record<FitModel, string>;
/**
 * How the straight-line fits weigh the points: unweighted least squares, or weighted by 1/σ² of
 * each I0/I, σ from the readings' own uncertainties, else (replicate runs) from the scatter of the
 * runs at each concentration (Bevington & Robinson, Data Reduction and Error Analysis, ch. 6).
 */
export const fitWeightings = ['unweighted', 'weighted'] as const;
export const fitWeightingSchema = z.enum(fitWeightings).meta({
  id: 'FitWeighting',
  description:
    "unweighted least squares, or weights 1/σ² from the readings' uncertainties (else the replicate scatter); straight-line models only",
});
export type FitWeighting = z.infer<typeof fitWeightingSchema>;
/** Each weighting in words, for the fit controls. */
export const fitWeightingNames = {
  unweighted: 'Unweighted',
  weighted: 'Weighted by 1/σ²',
} as const satisfies Record<FitWeighting, string>;
export const pinnedMechanisms = ['oxidative', 'reductive', 'energy-transfer'] as const;
export const solventIds = Object.keys(SOLVENTS) as [string, ...string[]];

const positive = (unit: string) => z.number().finite().positive(`must be above zero (${unit})`);
const wavelength = z.number().finite().min(150, 'must be 150–2000 nm').max(2000, 'must be 150–2000 nm').nullable();

export const studySettingsSchema = z.object({
  title: z.string().trim().min(1, 'must not be empty').max(200),
  solventId: z.enum(solventIds).nullable().describe('A solvent of the engine table, or null with a custom solvent'),
  customSolventName: z.string().trim().max(80).nullable(),
  customViscosity: positive('Pa s').nullable().describe('Pa s, for a custom solvent or another temperature'),
  temperature: z.number().finite().min(150, 'must be 150–500 K').max(500, 'must be 150–500 K').describe('K'),
  excitationWavelength: wavelength,
  emissionWavelength: wavelength,
  windowStart: wavelength.describe('integration window start, nm'),
  windowEnd: wavelength.describe('integration window end, nm'),
  atmosphere: z.enum(studyAtmospheres),
  degassingMethod: z.enum(degassingMethods),
  tau0: positive('s').nullable().describe('unquenched lifetime, s'),
  tau0Uncertainty: z.number().finite().min(0, 'cannot be negative').nullable().describe('s, one standard uncertainty'),
  tau0LifetimeId: z.string().uuid().nullable().describe('lifetime record of the emitter the tau0 came from'),
  i0: positive('intensity units').nullable().describe('unquenched intensity when the series has no blank'),
  dataKind: z.enum(['intensity', 'ratio']).describe('whether the series holds intensities or I0/I ratios'),
  fitModel: fitModelSchema,
  fitWeighting: fitWeightingSchema,
  dilutionCorrection: z.boolean(),
  initialVolume: positive('L').nullable().describe('V0, L'),
  stockConcentration: positive('mol/L').nullable().describe('quencher stock, mol/L'),
  stockContainsEmitter: z.boolean(),
  innerFilterCorrection: z.boolean(),
  pinnedMechanism: z.enum(pinnedMechanisms).nullable(),
  notes: z.string().max(5000),
});
export type StudySettings = z.infer<typeof studySettingsSchema>;

export interface SettingsIssue {
  path: string;
  message: string;
}

/** Rules that tie fields together; the create schema, the update service and the form all use them. */
export function studySettingsIssues(settings: StudySettings): SettingsIssue[] {
  const issues: SettingsIssue[] = [];
  if (!settings.solventId && !settings.customSolventName)
    issues.push({ path: 'solventId', message: 'pick a solvent or name a custom one' });
  if (!settings.solventId && settings.customSolventName && settings.customViscosity === null) {
    issues.push({
      path: 'customViscosity',
      message: 'a custom solvent needs its viscosity (Pa s) for the diffusion limit',
    });
  }
  if (settings.windowStart !== null && settings.windowEnd !== null && settings.windowEnd <= settings.windowStart) {
    issues.push({ path: 'windowEnd', message: 'must be above the window start' });
  }
  if (settings.dilutionCorrection && settings.initialVolume === null)
    issues.push({ path: 'initialVolume', message: 'the dilution correction needs the starting volume V0' });
  if (settings.dilutionCorrection && settings.stockConcentration === null)
    issues.push({ path: 'stockConcentration', message: 'the dilution correction needs the stock concentration' });
  return issues;
}

const compoundChoice = {
  emitterId: z.string().uuid('must be a compound id').nullable().optional(),
  newEmitterName: z
    .string()
    .trim()
    .min(1)
    .max(160)
    .optional()
    .describe('creates the emitter in the library when no id is given'),
  quencherId: z.string().uuid('must be a compound id').nullable().optional(),
  newQuencherName: z.string().trim().min(1).max(160).optional(),
};

const shape = studySettingsSchema.shape;
/** Optional on create, with these defaults; title, solvent, atmosphere and degassing must be given. */
const createDefaults = {
  solventId: shape.solventId.default(null),
  customSolventName: shape.customSolventName.default(null),
  customViscosity: shape.customViscosity.default(null),
  temperature: shape.temperature.default(298.15),
  excitationWavelength: shape.excitationWavelength.default(null),
  emissionWavelength: shape.emissionWavelength.default(null),
  windowStart: shape.windowStart.default(null),
  windowEnd: shape.windowEnd.default(null),
  tau0: shape.tau0.default(null),
  tau0Uncertainty: shape.tau0Uncertainty.default(null),
  tau0LifetimeId: shape.tau0LifetimeId.default(null),
  i0: shape.i0.default(null),
  dataKind: shape.dataKind.default('intensity'),
  fitModel: shape.fitModel.default('linear-free'),
  fitWeighting: shape.fitWeighting.default('unweighted'),
  dilutionCorrection: shape.dilutionCorrection.default(false),
  initialVolume: shape.initialVolume.default(null),
  stockConcentration: shape.stockConcentration.default(null),
  stockContainsEmitter: shape.stockContainsEmitter.default(false),
  innerFilterCorrection: shape.innerFilterCorrection.default(false),
  pinnedMechanism: shape.pinnedMechanism.default(null),
  notes: shape.notes.default(''),
};

export const createStudySchema = studySettingsSchema
  .extend({ ...createDefaults, ...compoundChoice })
  .superRefine((value, context) => {
    for (const issue of studySettingsIssues(value))
      context.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
    if (!value.emitterId && !value.newEmitterName)
      context.addIssue({ code: 'custom', path: ['emitterId'], message: 'pick an emitter or name a new one' });
    if (!value.quencherId && !value.newQuencherName)
      context.addIssue({ code: 'custom', path: ['quencherId'], message: 'pick a quencher or name a new one' });
  })
  .meta({ id: 'CreateStudy' });
export type CreateStudyInput = z.output<typeof createStudySchema>;
export type CreateStudyBody = z.input<typeof createStudySchema>;

export const updateStudySchema = studySettingsSchema
  .partial()
  .extend({
    ...compoundChoice,
    version: z.number().int().min(0).describe('the version you edited; a stale one gets 409'),
  })
  .meta({ id: 'UpdateStudy' });
export type UpdateStudyInput = z.infer<typeof updateStudySchema>;

export const studyParamsSchema = labParamsSchema.extend({ studyId: z.string().uuid('must be a study id') });

export const compoundRefSchema = z.object({ id: z.string().uuid(), name: z.string() }).meta({ id: 'CompoundRef' });

export const studySummarySchema = z
  .object({
    id: z.string().uuid(),
    title: z.string(),
    emitter: compoundRefSchema,
    quencher: compoundRefSchema,
    solventLabel: z.string(),
    status: studyStatusSchema,
    revision: z.number().int(),
    ownerId: z.string().nullable(),
    ownerName: z.string(),
    kSv: z.number().nullable().describe('M^-1, from the newest fit'),
    kq: z.number().nullable().describe('M^-1 s^-1, from the newest fit'),
    flagged: z.boolean(),
    updatedAt: z.string(),
  })
  .meta({ id: 'StudySummary' });
export type StudySummary = z.infer<typeof studySummarySchema>;

export const studySortKeys = ['updated', 'kq', 'k_sv'] as const;
export const listStudiesQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  emitterId: z.string().uuid().optional(),
  quencherId: z.string().uuid().optional(),
  solventId: z.string().max(80).optional(),
  status: studyStatusSchema.optional(),
  ownerId: z.string().uuid().optional(),
  flagged: z.enum(['true', 'false']).optional().describe('"true": only studies with a flag'),
  q: z.string().trim().max(200).optional().describe('words in the title or notes'),
  sort: z.enum(studySortKeys).default('updated'),
  direction: z.enum(['asc', 'desc']).default('desc'),
  cursor: z
    .string()
    .max(400)
    .optional()
    .describe(
      'nextCursor or previousCursor of a page (same filters and sort): the page after or before it; page then only numbers it',
    ),
});
export type ListStudiesQuery = z.infer<typeof listStudiesQuerySchema>;

export const studyListSchema = z
  .object({
    items: z.array(studySummarySchema),
    total: z.number().int().describe('studies that match, counted up to 10,000'),
    totalCapped: z.boolean().describe('true: more than `total` (10,000) studies match; counting stopped there'),
    page: z.number().int(),
    pageSize: z.number().int(),
    nextCursor: z.string().nullable().describe('asks for the page after this one; null on the last page'),
    previousCursor: z.string().nullable().describe('asks for the page before this one; null on the first page'),
  })
  .meta({ id: 'StudyList' });
export type StudyList = z.infer<typeof studyListSchema>;

export const studyFormOptionsSchema = z
  .object({
    compounds: z.array(
      z.object({ id: z.string().uuid(), name: z.string(), roleHint: z.enum(['photocatalyst', 'quencher', 'both']) }),
    ),
    lifetimes: z.array(
      z.object({
        id: z.string().uuid(),
        compoundId: z.string().uuid(),
        value: z.number().describe('s'),
        uncertainty: z.number().nullable(),
        solvent: z.string(),
        atmosphere: z.string(),
        temperature: z.number(),
      }),
    ),
    solvents: z.array(
      z.object({ id: z.string(), name: z.string(), viscosity: z.number().nullable().describe('Pa s at 25 °C') }),
    ),
    members: z.array(z.object({ userId: z.string().uuid(), name: z.string() })),
  })
  .meta({ id: 'StudyFormOptions' });
export type StudyFormOptions = z.infer<typeof studyFormOptionsSchema>;
