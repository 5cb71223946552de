import { z } from 'zod';
import { bandWidthFormSchema, bandWidthSchema } from './band-width';
import { mechanismVerdictChangeSchema } from './mechanism-evidence';
import { mechanismFileSchema, spectrumMatrixReadingSchema } from './spectrum-matrices';
import { studyParamsSchema } from './studies';
import { estimateSchema } from './study-fits';

/*
 * Absorption evidence for a ground-state complex: UV-vis spectra of the study's emitter at
 * several quencher concentrations, uploaded as one matrix like an emission matrix (wavelength in
 * nm in the first column, one absorbance spectrum per column with its [Q] in the header), and
 * optionally the quencher's own absorbance as a second file (wavelength and one column: a
 * spectrum with its [Q] in the header, or ε in M^-1 cm^-1 with a header starting "ε" or
 * "epsilon"). Concentrations in mol/L, wavelengths in nm, path length in cm, K_a in M^-1.
 */

export const MAX_ABSORPTION_BAND_WIDTH_NM = 50;
export const MAX_PATH_LENGTH_CM = 10;

/** A form field arrives as text: an empty one means "not given". */
const blankAsMissing = (value: unknown) => (value === '' || value === null ? undefined : value);

export const absorptionOptionsSchema = z
  .object({
    bandWidth: bandWidthFormSchema(MAX_ABSORPTION_BAND_WIDTH_NM, 5),
    pathLength: z
      .preprocess(
        blankAsMissing,
        z.coerce
          .number({ error: 'must be a length in cm' })
          .positive('must be greater than 0 cm')
          .max(MAX_PATH_LENGTH_CM, `must be at most ${MAX_PATH_LENGTH_CM} cm`)
          .default(1),
      )
      .describe('cm, the cell length'),
    emitterConcentration: z
      .preprocess(
        blankAsMissing,
        z.coerce
          .number({ error: 'must be a concentration in mol/L' })
          .positive('must be greater than 0 mol/L')
          .max(1, 'must be at most 1 mol/L')
          .optional(),
      )
      .describe('mol/L, [E]0: the exact 1:1 isotherm and Δε; without it the excess form'),
  })
  .meta({ id: 'AbsorptionOptions' });
export type AbsorptionOptions = z.output<typeof absorptionOptionsSchema>;

/**
 * Which fit gives the K_a the mechanism verdict and the comparison with K_S use: the 1:1 binding
 * isotherm by nonlinear least squares, or the Benesi–Hildebrand double-reciprocal line (Benesi &
 * Hildebrand, J. Am. Chem. Soc. 1949). Both are always fitted and shown.
 */
export const ASSOCIATION_FITS = ['isotherm', 'benesi-hildebrand'] as const;
export type AssociationFit = (typeof ASSOCIATION_FITS)[number];
const associationFitSchema = z
  .enum(ASSOCIATION_FITS, { error: 'must be "isotherm" or "benesi-hildebrand"' })
  .describe('the K_a the verdict and the comparison with K_S use');

/** How a kept titration is analysed: the upload options, whether the quencher's file is taken out, and the K_a used. */
export const absorptionSettingsSchema = z
  .object({
    bandWidth: z.number().describe('nm; 0 gives one band per wavelength'),
    pathLength: z.number().describe('cm'),
    emitterConcentration: z.number().optional().describe('mol/L; absent: the excess form'),
    subtractQuencher: z.boolean().describe("the quencher's own absorbance (its kept file) is taken out"),
    associationFit: associationFitSchema,
  })
  .meta({ id: 'AbsorptionSettings' });
export type AbsorptionSettings = z.infer<typeof absorptionSettingsSchema>;

/** Analyse a kept titration again from its kept files with new settings (every field given). */
export const absorptionReanalysisSchema = z
  .object({
    bandWidth: bandWidthSchema(MAX_ABSORPTION_BAND_WIDTH_NM),
    pathLength: z
      .number({ error: 'must be a length in cm' })
      .positive('must be greater than 0 cm')
      .max(MAX_PATH_LENGTH_CM, `must be at most ${MAX_PATH_LENGTH_CM} cm`)
      .describe('cm, the cell length'),
    emitterConcentration: z
      .number({ error: 'must be a concentration in mol/L, or null' })
      .positive('must be greater than 0 mol/L')
      .max(1, 'must be at most 1 mol/L')
      .nullable()
      .describe('mol/L, [E]0 for the exact isotherm; null for the excess form'),
    subtractQuencher: z
      .boolean({ error: 'must be true or false' })
      .describe("take the quencher's own absorbance out (needs the titration's quencher file)"),
    associationFit: associationFitSchema,
  })
  .meta({ id: 'AbsorptionReanalysis' });
export type AbsorptionReanalysis = z.infer<typeof absorptionReanalysisSchema>;

export const absorptionTitrationParamsSchema = studyParamsSchema.extend({
  titrationId: z.string().uuid('must be an absorption titration id'),
});

const band = z.object({ start: z.number(), end: z.number(), centre: z.number() });
const attempt = <T extends z.ZodType>(fit: T) =>
  z.object({ fit: fit.nullable(), problem: z.string().nullable().describe('why no fit, in words') });
const agreementSchema = z.object({
  difference: z.number().describe('M^-1, K_a − K_S'),
  standardError: z.number(),
  z: z.number(),
  agree: z.boolean().describe('within 1.96 combined SEs'),
});

export const absorptionAnalysisSchema = z
  .object({
    pathLength: z.number(),
    bandWidth: z.number(),
    emitterConcentration: z.number().nullable(),
    quencherCorrection: z.enum(['none', 'absorptivity', 'spectrum']),
    concentrations: z.array(z.number()),
    noiseLevels: z.array(z.number()).describe('absorbance SD of one reading of each difference spectrum'),
    threshold: z.object({ familyLevel: z.number(), tests: z.number().int(), z: z.number() }),
    bands: z.array(
      band.extend({
        blank: z.number(),
        changes: z.array(z.number()),
        largestZ: z.number(),
        changed: z.boolean(),
      }),
    ),
    largestChange: band.extend({ change: z.number(), z: z.number() }),
    binding: z
      .object({
        band,
        signals: z.array(z.number()),
        changes: z.array(z.number()),
        benesiHildebrand: attempt(
          z.object({
            kA: estimateSchema,
            limitingChange: estimateSchema,
            slope: estimateSchema,
            intercept: estimateSchema,
            rSquared: z.number(),
            points: z.array(z.object({ x: z.number(), y: z.number() })),
            degreesOfFreedom: z.number(),
            n: z.number().int(),
          }),
        ),
        isotherm: attempt(
          z.object({
            form: z.enum(['exact', 'excess']),
            kA: estimateSchema,
            baseline: estimateSchema,
            limitingChange: estimateSchema,
            fitted: z.array(z.number()),
            residuals: z.array(z.number()),
            residualSumOfSquares: z.number(),
            residualStandardDeviation: z.number(),
            degreesOfFreedom: z.number(),
            n: z.number().int(),
          }),
        ),
        deltaEpsilon: estimateSchema.nullable(),
      })
      .nullable(),
    comparison: z
      .object({
        kS: estimateSchema,
        benesiHildebrand: agreementSchema.nullable(),
        isotherm: agreementSchema.nullable(),
      })
      .nullable(),
    flags: z.array(z.object({ code: z.enum(['ABSORPTION_CHANGES']), title: z.string(), detail: z.string() })),
    notes: z.array(z.string()),
  })
  .meta({ id: 'AbsorptionAnalysis' });
export type AbsorptionAnalysisAnswer = z.infer<typeof absorptionAnalysisSchema>;

/** Spectra and difference spectra for the plot, at most 400 wavelengths (every k-th reading). */
export const absorptionPlotSchema = z
  .object({
    wavelengths: z.array(z.number()),
    spectra: z.array(
      z.object({ concentration: z.number(), values: z.array(z.number()), differences: z.array(z.number()) }),
    ),
  })
  .meta({ id: 'AbsorptionPlot' });
export type AbsorptionPlot = z.infer<typeof absorptionPlotSchema>;

export const quencherReadingSchema = z
  .object({
    header: z.string(),
    kind: z.enum(['absorptivity', 'spectrum']),
    concentration: z.number().nullable().describe('mol/L for a spectrum; null for ε'),
  })
  .meta({ id: 'QuencherReading' });

/** K_a against the study's K_S, worked out when read (the study's fit may change after the upload). */
export const absorptionComparisonSchema = z
  .object({
    kS: estimateSchema.nullable(),
    /** where K_S came from, or why there is none */
    source: z.string(),
    benesiHildebrand: agreementSchema.nullable(),
    isotherm: agreementSchema.nullable(),
  })
  .meta({ id: 'AbsorptionComparison' });
export type AbsorptionComparisonAnswer = z.infer<typeof absorptionComparisonSchema>;

export const absorptionPreviewSchema = z
  .object({
    reading: spectrumMatrixReadingSchema,
    quencher: quencherReadingSchema.nullable(),
    analysis: absorptionAnalysisSchema,
    plot: absorptionPlotSchema,
    comparison: absorptionComparisonSchema,
  })
  .meta({ id: 'AbsorptionPreview' });
export type AbsorptionPreview = z.infer<typeof absorptionPreviewSchema>;

export const absorptionTitrationSchema = absorptionPreviewSchema
  .extend({
    id: z.string().uuid(),
    studyId: z.string().uuid(),
    title: z.string(),
    file: mechanismFileSchema,
    quencherFile: mechanismFileSchema.nullable(),
    options: absorptionSettingsSchema,
    engineVersion: z.string(),
    createdBy: z.string().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: 'AbsorptionTitration' });
export type AbsorptionTitration = z.infer<typeof absorptionTitrationSchema>;

export const absorptionTitrationListSchema = z
  .object({ items: z.array(absorptionTitrationSchema) })
  .meta({ id: 'AbsorptionTitrationList' });
export type AbsorptionTitrationList = z.infer<typeof absorptionTitrationListSchema>;

export const absorptionTitrationReanalysedSchema = z
  .object({ titration: absorptionTitrationSchema, verdict: mechanismVerdictChangeSchema })
  .meta({ id: 'AbsorptionTitrationReanalysed' });
export type AbsorptionTitrationReanalysed = z.infer<typeof absorptionTitrationReanalysedSchema>;
