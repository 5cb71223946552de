import { z } from 'zod';
import { qualityFlagSchema } from './quality-flag';
import { fitModelSchema, fitWeightingSchema } from './studies';

export const estimateSchema = z
  .object({
    value: z.number(),
    standardError: z.number(),
    interval95: z.object({ lower: z.number(), upper: z.number() }),
    includes: z
      .string()
      .optional()
      .describe('what the standard error includes, e.g. "scatter of the points and I0 from 3 blanks"'),
  })
  .meta({ id: 'Estimate' });
export type Estimate = z.infer<typeof estimateSchema>;

const plotPointSchema = z.object({ x: z.number(), y: z.number() });

/** An axis of a stored plot series: its title with the unit, and the factor from stored x to the axis. */
export const plotAxisSchema = z
  .object({
    label: z.string().describe('axis title with its unit, e.g. "[Q] (mM)" or "1/[Q] (mM⁻¹)"'),
    unit: z.string(),
    scale: z.number().positive().describe('multiply a stored x (SI: M or M⁻¹) by this for the value on the axis'),
  })
  .meta({ id: 'PlotAxis' });
export type PlotAxis = z.infer<typeof plotAxisSchema>;

/** What a fit found; parameters by name (kSv, intercept, kq, kD, kS, accessibleFraction, ...). */
export const fitResultSchema = z
  .object({
    parameters: z.record(z.string(), estimateSchema),
    statistics: z.object({
      n: z.number().int(),
      degreesOfFreedom: z.number(),
      rSquared: z.number().nullable(),
      rSquaredDefinition: z
        .enum(['centred', 'uncentred'])
        .nullable()
        .optional()
        .describe('uncentred for a line through 1: 1 - SS_res / sum (ratio - 1)^2, near 1 even for a poor line'),
      rSquaredCentred: z
        .number()
        .nullable()
        .optional()
        .describe('centred R² of the same fitted line, 1 - SS_res / sum (ratio - mean)^2'),
      residualStandardDeviation: z.number().nullable(),
      curvature: z.enum(['linear', 'upward', 'downward']).nullable(),
      curvaturePValue: z.number().nullable(),
    }),
    intensity: z
      .enum(['fitted', 'no-intensity-data'])
      .optional()
      .describe(
        'no-intensity-data: the series holds lifetimes only, and K_SV and kq come from the lifetime line τ0/τ (absent in older fits: fitted)',
      ),
    reference: z.object({
      kind: z
        .enum(['i0', 'ratio-data', 'replicate-runs', 'lifetime-tau0'])
        .describe('lifetime-tau0: lifetimes only, the ratios are τ0/τ and value is τ0 in s'),
      value: z.number(),
      source: z.string(),
    }),
    replicates: z
      .object({
        runs: z.array(
          z.object({
            series: z.number().int(),
            value: z.number().describe("the run's I0"),
            standardError: z.number().nullable(),
            blanks: z.number().int(),
          }),
        ),
        summary: z
          .array(
            z.object({ concentration: z.number(), n: z.number().int(), mean: z.number(), sd: z.number().nullable() }),
          )
          .describe('per concentration: readings, mean I0/I and its sample SD'),
        weighting: z
          .object({
            source: z.enum(['point-uncertainties', 'replicate-scatter']),
            weighted: estimateSchema,
            unweighted: estimateSchema,
            shift: z.number().describe('K_SV weighted − unweighted, M⁻¹'),
            beyondStandardError: z.boolean(),
            pointsWeighted: z.number().int(),
          })
          .nullable(),
      })
      .nullish()
      .describe('several titration runs pooled, each by its own I0 (absent for one run)'),
    weighting: z
      .object({
        chosen: fitWeightingSchema,
        applied: z
          .enum(['unweighted', 'point-uncertainties', 'replicate-scatter'])
          .describe('what the reported fit used: no weights, or 1/σ² from the readings or the replicate scatter'),
        pointsWeighted: z.number().int().nullable().describe('points in the weighted fit (null when unweighted)'),
        reason: z.string().nullable().describe('why a weighted fit was chosen but not made'),
      })
      .nullish()
      .describe('the weighting of the reported K_SV (absent in fits made before the choice existed)'),
    tau0: z
      .object({
        value: z.number(),
        standardError: z.number().nullable().describe('s; null when τ0 has no uncertainty of its own'),
        kind: z.enum(['lifetime-record', 'entered', 'lifetime-series']),
        source: z.string(),
      })
      .nullable(),
    diffusionLimit: z
      .object({ value: z.number(), basis: z.string(), ratio: z.number().nullable() })
      .nullable()
      .describe('k_diff in M^-1 s^-1 and kq/k_diff'),
    lifetime: z
      .object({
        kSv: estimateSchema,
        intercept: z
          .enum(['free', 'fixed-at-one'])
          .optional()
          .describe('treated like the intensity line it is compared with'),
        rSquared: z.number(),
        verdict: z.string().nullable(),
        points: z.array(plotPointSchema),
        excluded: z
          .array(plotPointSchema.extend({ position: z.number().int() }))
          .optional()
          .describe('left-out lifetimes at their plotted coordinates (absent before engine 1.5.0)'),
        xAxis: plotAxisSchema,
      })
      .nullable(),
    flags: z.array(qualityFlagSchema),
    notes: z.array(z.string()),
    corrections: z
      .array(
        z.object({
          position: z.number().int(),
          concentration: z.number().describe('mol/L after the dilution correction'),
          intensity: z.number().nullable().describe('intensity (or I0/I) after the switched-on corrections'),
          dilutionFactor: z.number().nullable(),
          innerFilterFactor: z.number().nullable(),
        }),
      )
      .nullish()
      .describe(
        "each point's values after the switched-on corrections, left-out points too; null when none is on (absent before engine 1.5.0)",
      ),
    plot: z
      .object({
        xAxis: plotAxisSchema,
        yLabel: z.string(),
        points: z.array(plotPointSchema.extend({ position: z.number().int(), residual: z.number() })),
        line: z.array(plotPointSchema.extend({ lower: z.number(), upper: z.number() })),
        excluded: z
          .array(plotPointSchema.extend({ position: z.number().int() }))
          .describe('left-out points at their plotted coordinates (corrected, on the model axes)'),
      })
      .describe('x in SI (M, or M⁻¹ for the modified model); draw x × xAxis.scale'),
  })
  .meta({ id: 'FitResult' });
export type FitResult = z.infer<typeof fitResultSchema>;

export const studyFitSchema = z
  .object({
    id: z.string().uuid(),
    model: fitModelSchema,
    weighting: fitWeightingSchema
      .nullable()
      .describe('the weighting chosen for this fit; null before the choice existed'),
    trigger: z.enum(['auto', 'manual']),
    kSv: z.number().nullable(),
    kq: z.number().nullable(),
    result: fitResultSchema,
    pointsUsed: z.array(z.object({ position: z.number().int(), concentration: z.number(), ratio: z.number() })),
    engineVersion: z.string(),
    createdBy: z.string().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: 'StudyFit' });
export type StudyFit = z.infer<typeof studyFitSchema>;

export const runFitSchema = z
  .object({
    model: fitModelSchema,
    weighting: fitWeightingSchema.optional().describe("default: the study's current weighting"),
  })
  .meta({ id: 'RunFit' });
export type RunFitBody = z.input<typeof runFitSchema>;
export const fitListSchema = z.object({ items: z.array(studyFitSchema) }).meta({ id: 'FitList' });
