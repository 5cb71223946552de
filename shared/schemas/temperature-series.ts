import { z } from 'zod';
import { estimateSchema } from './study-fits';

/** Comma-separated study ids of one temperature series, as sent in the query string. */
export const temperatureSeriesQuerySchema = z.object({
  studies: z
    .string()
    .trim()
    .min(1, 'is required: the ids of the studies, separated by commas')
    .max(2000)
    .transform((text) => text.split(',').map((id) => id.trim()))
    .pipe(
      z
        .array(z.string().uuid('must be study ids separated by commas'))
        .min(1)
        .max(40, 'at most 40 studies in one series'),
    )
    .describe('study ids separated by commas: one emitter–quencher pair in one solvent at several temperatures'),
});
export type TemperatureSeriesQuery = z.infer<typeof temperatureSeriesQuerySchema>;

const compoundRefSchema = z.object({ id: z.string().uuid(), name: z.string() });

export const temperatureSeriesGroupSchema = z
  .object({
    emitter: compoundRefSchema,
    quencher: compoundRefSchema,
    solvent: z.string().describe('solvent id of the table, or the custom solvent name'),
    solventName: z.string(),
    studyIds: z.array(z.string().uuid()),
    temperatures: z.array(z.number()).describe('distinct temperatures, K, ascending'),
    ready: z.boolean().describe('at least 3 distinct temperatures with a fitted K_SV'),
  })
  .meta({ id: 'TemperatureSeriesGroup' });
export type TemperatureSeriesGroup = z.infer<typeof temperatureSeriesGroupSchema>;

export const temperatureSeriesListSchema = z.object({ items: z.array(temperatureSeriesGroupSchema) });
export type TemperatureSeriesList = z.infer<typeof temperatureSeriesListSchema>;

export const temperatureSeriesPointSchema = z.object({
  studyId: z.string().uuid(),
  title: z.string(),
  status: z.string(),
  temperature: z.number().describe('K'),
  kSv: estimateSchema.describe('M^-1'),
  kq: estimateSchema.nullable().describe('M^-1 s^-1; null without tau0'),
  viscosity: z.number().describe('Pa s at this temperature'),
  viscositySource: z.string(),
  temperatureOverViscosity: z.number().describe('T/eta, K Pa^-1 s^-1'),
  diffusionLimit: z.number().describe('k_diff = 8RT/3eta(T), M^-1 s^-1'),
});

export const temperatureSeriesAnalysisSchema = z
  .object({
    emitter: compoundRefSchema,
    quencher: compoundRefSchema,
    solvent: z.string(),
    solventName: z.string(),
    points: z.array(temperatureSeriesPointSchema),
    verdict: z.enum(['dynamic', 'static', 'mixed-or-unclear']),
    reasons: z.array(z.string()),
    kSvActivationEnergy: estimateSchema.describe('J/mol, > 0 when K_SV rises with T'),
    diffusionActivationEnergy: z.number().describe('J/mol, of T/eta'),
    viscousFlowActivationEnergy: z.number().describe('J/mol, E_eta of the solvent over these temperatures'),
    stepRatio: z.number(),
    arrhenius: z
      .object({
        activationEnergy: estimateSchema.describe('Ea, J/mol'),
        lnPreExponentialFactor: estimateSchema.describe('ln(A / M^-1 s^-1)'),
      })
      .nullable(),
    eyring: z
      .object({
        activationEnthalpy: estimateSchema.describe('J/mol'),
        activationEntropy: estimateSchema.describe('J/(mol K), 1 M standard state'),
      })
      .nullable(),
    notes: z.array(z.string()),
  })
  .meta({ id: 'TemperatureSeriesAnalysis' });
export type TemperatureSeriesAnalysis = z.infer<typeof temperatureSeriesAnalysisSchema>;
