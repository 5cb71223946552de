import { z } from 'zod';
import { bandWidthFormSchema, bandWidthSchema } from './band-width';
import { decayFileSchema } from './decays';
import { labParamsSchema } from './members';
import { mechanismVerdictChangeSchema } from './mechanism-evidence';
import { studyParamsSchema } from './studies';
import { estimateSchema } from './study-fits';

/*
 * Wavelength-resolved Stern–Volmer evidence: emission spectra of one study at several quencher
 * concentrations, uploaded as one matrix (wavelength in nm in the first column, one spectrum per
 * column with its concentration in the header; or JCAMP-DX blocks). Concentrations in mol/L,
 * wavelengths in nm, K_SV in M^-1.
 */

/** The largest band width offered (nm): wider bands leave too few to compare. */
export const MAX_BAND_WIDTH_NM = 100;

export const spectrumMatrixOptionsSchema = z
  .object({
    bandWidth: bandWidthFormSchema(MAX_BAND_WIDTH_NM, 10),
  })
  .meta({ id: 'SpectrumMatrixOptions' });
export type SpectrumMatrixOptions = z.output<typeof spectrumMatrixOptionsSchema>;

export const spectrumMatrixParamsSchema = studyParamsSchema.extend({
  matrixId: z.string().uuid('must be a spectrum matrix id'),
});
export const mechanismFileParamsSchema = labParamsSchema.extend({
  fileId: z.string().uuid('must be a file id'),
});

export const spectrumMatrixReadingSchema = z
  .object({
    format: z.string(),
    wavelengthHeader: z.string(),
    /** nm */
    firstWavelength: z.number(),
    lastWavelength: z.number(),
    wavelengthCount: z.number().int(),
    samples: z.array(z.object({ header: z.string(), concentration: z.number().describe('mol/L') })),
  })
  .meta({ id: 'SpectrumMatrixReading' });
export type SpectrumMatrixReading = z.infer<typeof spectrumMatrixReadingSchema>;

export const spectrumMatrixFlagSchema = z
  .object({
    code: z.enum(['KSV_VARIES_WITH_WAVELENGTH', 'NEW_COMPONENT_GROWS']),
    title: z.string(),
    detail: z.string(),
  })
  .meta({ id: 'SpectrumMatrixFlag' });

export const spectrumMatrixAnalysisSchema = z
  .object({
    bandWidth: z.number(),
    bands: z.array(
      z.object({
        start: z.number(),
        end: z.number(),
        centre: z.number(),
        i0: z.number(),
        kSv: estimateSchema.nullable().describe('M^-1; null where the blank is below 5 % of the strongest band'),
        rises: z.boolean().describe('the emission in this band rises with [Q] (95 % level)'),
      }),
    ),
    homogeneity: z
      .object({
        weightedMean: z.number(),
        weightedMeanStandardError: z.number(),
        chiSquare: z.number(),
        degreesOfFreedom: z.number().int(),
        pValue: z.number(),
        homogeneous: z.boolean(),
      })
      .nullable(),
    components: z.object({
      singularValues: z.array(z.number()),
      noiseLevels: z.array(z.number()),
      noiseThreshold: z.number(),
      significant: z.number().int(),
    }),
    flags: z.array(spectrumMatrixFlagSchema),
  })
  .meta({ id: 'SpectrumMatrixAnalysis' });
export type SpectrumMatrixAnalysisAnswer = z.infer<typeof spectrumMatrixAnalysisSchema>;

/** The spectra for the plot, at most PLOT_POINTS wavelengths each (every k-th reading). */
export const spectrumPlotSchema = z
  .object({
    wavelengths: z.array(z.number()),
    spectra: z.array(z.object({ concentration: z.number(), values: z.array(z.number()) })),
  })
  .meta({ id: 'SpectrumPlot' });
export type SpectrumPlot = z.infer<typeof spectrumPlotSchema>;

/** A kept file's name, size and SHA-256: the same fields as a decay file's. */
export const mechanismFileSchema = decayFileSchema.meta({ id: 'MechanismFile' });

export const spectrumMatrixSchema = z
  .object({
    id: z.string().uuid(),
    studyId: z.string().uuid(),
    title: z.string(),
    file: mechanismFileSchema,
    reading: spectrumMatrixReadingSchema,
    analysis: spectrumMatrixAnalysisSchema,
    plot: spectrumPlotSchema,
    engineVersion: z.string(),
    createdBy: z.string().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: 'SpectrumMatrix' });
export type SpectrumMatrix = z.infer<typeof spectrumMatrixSchema>;

export const spectrumMatrixListSchema = z
  .object({ items: z.array(spectrumMatrixSchema) })
  .meta({ id: 'SpectrumMatrixList' });
export type SpectrumMatrixList = z.infer<typeof spectrumMatrixListSchema>;

/** Analyse a kept matrix again from its kept file at another band width. */
export const spectrumMatrixReanalysisSchema = z
  .object({
    bandWidth: bandWidthSchema(MAX_BAND_WIDTH_NM),
  })
  .meta({ id: 'SpectrumMatrixReanalysis' });
export type SpectrumMatrixReanalysis = z.infer<typeof spectrumMatrixReanalysisSchema>;

export const spectrumMatrixReanalysedSchema = z
  .object({ matrix: spectrumMatrixSchema, verdict: mechanismVerdictChangeSchema })
  .meta({ id: 'SpectrumMatrixReanalysed' });
export type SpectrumMatrixReanalysed = z.infer<typeof spectrumMatrixReanalysedSchema>;

/** What discarding a kept matrix or titration did to the study's verdict. */
export const spectraDiscardedSchema = z
  .object({ verdict: mechanismVerdictChangeSchema })
  .meta({ id: 'SpectraDiscarded' });
export type SpectraDiscarded = z.infer<typeof spectraDiscardedSchema>;
