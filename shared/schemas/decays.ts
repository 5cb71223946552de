import { z } from 'zod';
import { atmospheres } from './library-measurements';
import { solventSchema } from './library';
import { qualityFlagSchema } from './quality-flag';

/*
 * Decay histograms (time-correlated single photon counting, multichannel scaling) and their
 * fits. Times travel in s, concentrations in mol/L, amplitudes and background in counts per
 * channel. A decay set is one uploaded file (with its own response file or column) attached to a
 * study or to an emitter of the library.
 */

/** Units a decay file's time column may carry (the header names it). */
export const decayTimeUnits = ['ps', 'ns', 'us', 'ms', 's'] as const;
export type DecayTimeUnit = (typeof decayTimeUnits)[number];

export const decayModelSchema = z
  .object({
    components: z
      .union([z.literal(1), z.literal(2), z.literal(3)], { error: 'must be 1, 2 or 3 exponentials' })
      .default(1),
    method: z
      .enum(['reconvolution', 'tail'])
      .nullable()
      .default(null)
      .describe('null: reconvolution when the set has a response, else a tail fit'),
    estimator: z
      .enum(['poisson', 'least-squares'])
      .default('poisson')
      .describe('poisson: maximum likelihood; least-squares: weights 1/max(counts, 1)'),
    startChannel: z.number().int().min(0).nullable().default(null).describe('0-based; null: automatic'),
    endChannel: z.number().int().min(0).nullable().default(null).describe('0-based, included; null: the last channel'),
  })
  .meta({ id: 'DecayModel' });
export type DecayModelInput = z.input<typeof decayModelSchema>;
export type DecayModel = z.output<typeof decayModelSchema>;

export const decayColumnRoles = ['decay', 'response', 'ignore'] as const;
export const decayColumnSchema = z
  .object({
    column: z.number().int().min(1).describe('0-based column of the table; column 0 is time'),
    role: z.enum(decayColumnRoles),
    concentration: z
      .number()
      .finite()
      .min(0, 'cannot be negative (mol/L)')
      .nullable()
      .describe('quencher concentration of a decay, mol/L; null: not known'),
  })
  .meta({ id: 'DecayColumn' });
export type DecayColumn = z.infer<typeof decayColumnSchema>;

/** What the person chose in the preview; everything has a default, so a bare upload is read as proposed. */
export const decayReadOptionsSchema = z
  .object({
    timeUnit: z
      .enum(decayTimeUnits)
      .nullable()
      .default(null)
      .describe('unit of the time column when its header names none'),
    columns: z.array(decayColumnSchema).max(2000).nullable().default(null).describe('null: as proposed'),
    model: decayModelSchema.default({
      components: 1,
      method: null,
      estimator: 'poisson',
      startChannel: null,
      endChannel: null,
    }),
    countRate: z.number().positive().nullable().default(null).describe('detected photons per second'),
    repetitionRate: z.number().positive().nullable().default(null).describe('excitation pulses per second'),
    show: z.number().int().min(0).default(0).describe('which decay the preview draws (0-based)'),
  })
  .meta({ id: 'DecayReadOptions' });
export type DecayReadOptionsInput = z.input<typeof decayReadOptionsSchema>;
export type DecayReadOptions = z.output<typeof decayReadOptionsSchema>;

/** A single decay of an emitter for the library: the conditions its lifetime record carries. */
export const libraryDecayOptionsSchema = decayReadOptionsSchema
  .extend({
    solvent: solventSchema,
    atmosphere: z.enum(atmospheres, { error: 'must be one of the listed atmospheres' }),
    temperature: z
      .number()
      .min(77, 'must be at least 77 K')
      .max(500, 'must be at most 500 K')
      .default(298.15)
      .describe('K'),
    notes: z.string().trim().max(4000).default(''),
  })
  .meta({ id: 'LibraryDecayOptions' });
export type LibraryDecayOptionsInput = z.input<typeof libraryDecayOptionsSchema>;

const estimate = z.object({ value: z.number(), standardError: z.number() });

export const decayFitResultSchema = z
  .object({
    method: z.enum(['reconvolution', 'tail']),
    estimator: z.enum(['poisson', 'least-squares']),
    components: z.array(
      z.object({
        lifetime: estimate.describe('s'),
        amplitude: estimate.describe('counts per channel at time zero'),
        fractionalAmplitude: estimate,
        fractionalIntensity: z.number(),
      }),
    ),
    background: estimate.describe('counts per channel'),
    shift: estimate.nullable().describe('s'),
    amplitudeWeightedLifetime: estimate.describe('s'),
    intensityWeightedLifetime: estimate.describe('s'),
    chiSquared: z.number(),
    degreesOfFreedom: z.number().int(),
    reducedChiSquared: z.number(),
    deviance: z.number(),
    residualLagOne: z.number(),
    residualRunsPValue: z.number(),
    startChannel: z.number().int(),
    endChannel: z.number().int(),
    channelWidth: z.number().describe('s'),
    peakCounts: z.number(),
    responseWidth: z.number().nullable().describe('FWHM of the response, s'),
    iterations: z.number().int(),
    converged: z.boolean(),
    flags: z.array(qualityFlagSchema),
    parameters: z.array(z.number()).describe('the exact parameter vector, to draw the curves again'),
  })
  .meta({ id: 'DecayFitResult' });
export type DecayFitResult = z.infer<typeof decayFitResultSchema>;

/** The lifetime a decay gives a Stern–Volmer plot: tau itself, or the amplitude-weighted mean (shared/engine/README.md section 11). */
export const decayLifetimeSchema = z
  .object({
    value: z.number().describe('s'),
    standardError: z.number().describe('s'),
    basis: z.enum(['single-exponential', 'amplitude-weighted-mean']),
  })
  .meta({ id: 'DecayLifetime' });
export type DecayLifetime = z.infer<typeof decayLifetimeSchema>;

export const decayOutcomeSchema = z
  .object({
    index: z.number().int().describe('0-based decay of the set'),
    label: z.string(),
    concentration: z.number().nullable().describe('mol/L'),
    fit: decayFitResultSchema.nullable(),
    lifetime: decayLifetimeSchema.nullable(),
    problem: z.string().nullable().describe('why this decay could not be fitted'),
  })
  .meta({ id: 'DecayOutcome' });
export type DecayOutcome = z.infer<typeof decayOutcomeSchema>;

export const decayCurvesSchema = z
  .object({
    index: z.number().int(),
    label: z.string(),
    time: z.array(z.number()).describe('s, one per channel'),
    counts: z.array(z.number()),
    response: z.array(z.number()).nullable().describe('the measured response, counts'),
    model: z.array(z.number().nullable()).nullable().describe('fitted counts per channel'),
    weightedResiduals: z.array(z.number()).nullable().describe('(c - m)/sqrt(m) from startChannel'),
    autocorrelation: z.array(z.number()).nullable().describe('of the weighted residuals, lag 0 up'),
    startChannel: z.number().int().nullable(),
  })
  .meta({ id: 'DecayCurves' });
export type DecayCurves = z.infer<typeof decayCurvesSchema>;

export const decayTableColumnSchema = z.object({
  column: z.number().int(),
  header: z.string(),
  role: z.enum(decayColumnRoles),
  concentration: z.number().nullable().describe('mol/L'),
});

/** The file as read: its shape and the roles of its columns (proposed or chosen). */
export const decayReadingSummarySchema = z.object({
  format: z.string(),
  timeHeader: z.string(),
  timeUnit: z.enum(decayTimeUnits).nullable(),
  channelWidth: z.number().nullable().describe('s'),
  channels: z.number().int(),
  columns: z.array(decayTableColumnSchema),
  responseSource: z.enum(['column', 'file']).nullable(),
  warnings: z.array(z.string()),
});
export type DecayReadingSummary = z.infer<typeof decayReadingSummarySchema>;

export const decayPreviewSchema = decayReadingSummarySchema
  .extend({
    fileName: z.string(),
    responseFileName: z.string().nullable(),
    model: decayModelSchema,
    outcomes: z.array(decayOutcomeSchema),
    shown: decayCurvesSchema.nullable(),
    questions: z.array(z.string()).describe('what must be chosen before the set can be kept'),
  })
  .meta({ id: 'DecayPreview' });
export type DecayPreview = z.infer<typeof decayPreviewSchema>;

/** tau0/tau against [Q] from a set's fitted lifetimes (Lakowicz, 3rd ed., eq. 8.2). */
export const decaySternVolmerSchema = z
  .object({
    tau0: estimate.describe('s, from the zero-concentration decays'),
    kSv: estimate.describe('M^-1, the lifetime (dynamic) K_SV'),
    points: z.array(z.object({ concentration: z.number().describe('mol/L'), ratio: z.number(), label: z.string() })),
  })
  .meta({ id: 'DecaySternVolmer' });
export type DecaySternVolmer = z.infer<typeof decaySternVolmerSchema>;

export const decayFileSchema = z
  .object({
    id: z.string().uuid(),
    fileName: z.string(),
    size: z.number().int().describe('bytes'),
    sha256: z.string(),
    createdAt: z.string(),
  })
  .meta({ id: 'DecayFile' });

export const decaySetSchema = decayReadingSummarySchema
  .extend({
    id: z.string().uuid(),
    title: z.string(),
    studyId: z.string().uuid().nullable(),
    compoundId: z.string().uuid().nullable(),
    lifetimeId: z.string().uuid().nullable().describe('the library lifetime record this set feeds'),
    file: decayFileSchema,
    responseFile: decayFileSchema.nullable(),
    model: decayModelSchema,
    countRate: z.number().nullable(),
    repetitionRate: z.number().nullable(),
    outcomes: z.array(decayOutcomeSchema),
    sternVolmer: decaySternVolmerSchema.nullable(),
    sternVolmerProblem: z.string().nullable().describe('why the lifetime Stern–Volmer line cannot be drawn'),
    engineVersion: z.string(),
    createdBy: z.string().nullable(),
    createdById: z
      .string()
      .uuid()
      .nullable()
      .describe('who kept the set: a library set may be refitted by them, or a reviewer or admin'),
    version: z.number().int(),
    createdAt: z.string(),
  })
  .meta({ id: 'DecaySet' });
export type DecaySet = z.infer<typeof decaySetSchema>;

export const decaySetListSchema = z.object({ items: z.array(decaySetSchema) }).meta({ id: 'DecaySetList' });

export const decaySetParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  setId: z.string().uuid('must be a decay set id'),
});
export const decayCurveParamsSchema = decaySetParamsSchema.extend({
  index: z.coerce.number().int('must be a whole number').min(0).max(1999).describe('0-based decay of the set'),
});
export const studyDecaySetParamsSchema = decaySetParamsSchema.extend({
  studyId: z.string().uuid('must be a study id'),
});
export const decayFileParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  fileId: z.string().uuid('must be a decay file id'),
});

export const applyDecaySetSchema = z
  .object({ version: z.number().int().min(0).describe('the study version you edited; a stale one gets 409') })
  .meta({ id: 'ApplyDecaySet' });

export const compoundDecayParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  compoundId: z.string().uuid('must be a compound id'),
});

/** A kept set fitted again with another model: its files and column choices stay as they were kept. */
export const refitDecaySetSchema = z
  .object({
    model: decayModelSchema,
    version: z.number().int().min(0).describe('the decay set version you looked at; a stale one gets 409'),
  })
  .meta({ id: 'RefitDecaySet' });
export type RefitDecaySetInput = z.input<typeof refitDecaySetSchema>;

/** What a refit changed besides the set itself, so nothing changes unsaid. */
export const decaySetRefitSchema = z
  .object({
    set: decaySetSchema,
    study: z
      .object({
        studyId: z.string().uuid(),
        points: z.number().int().describe('points whose lifetime came from this set and now holds the new one'),
        tau0: z.boolean().describe("whether the study's tau0 came from this set and was replaced"),
      })
      .nullable()
      .describe('null: the set was never put into its study, so the study is unchanged'),
    lifetime: z
      .object({
        lifetimeId: z.string().uuid(),
        value: z.number().describe('s'),
        uncertainty: z.number().nullable().describe('s'),
        outdatedStudies: z
          .number()
          .int()
          .describe(
            'studies whose tau0 comes from the record and still hold the older value: each is refitted by choice',
          ),
      })
      .nullable()
      .describe('the library lifetime record the set feeds, changed to the new fit; null when it feeds none'),
  })
  .meta({ id: 'DecaySetRefit' });
export type DecaySetRefit = z.infer<typeof decaySetRefitSchema>;
