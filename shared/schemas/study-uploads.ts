import { z } from 'zod';
import { uploadSummarySchema } from './study-detail';
import { studyPointInputSchema } from './study-points';
import { concentrationUnitKeys, timeUnitKeys, volumeUnitKeys } from '../units/units';

export const concentrationUnits = concentrationUnitKeys;
export const timeUnits = timeUnitKeys;
export const volumeUnits = volumeUnitKeys;

const column = z.number().int().min(0).describe('0-based column index in the parsed table');

/** How a series table (one row per sample) maps onto points. */
export const seriesMappingSchema = z.object({
  layout: z.literal('series'),
  concentration: column,
  concentrationUnit: z
    .enum(concentrationUnits)
    .nullable()
    .describe('null until chosen: a header without a unit is never read as mol/L silently'),
  intensity: column.nullable(),
  intensityIsRatio: z.boolean().describe('the column already holds I0/I'),
  lifetime: column.nullable(),
  lifetimeUnit: z.enum(timeUnits),
  absorbanceExcitation: column.nullable(),
  absorbanceEmission: column.nullable(),
  volumeAdded: column.nullable(),
  volumeUnit: z.enum(volumeUnits),
  uncertainty: column.nullable(),
  run: column
    .nullable()
    .default(null)
    .describe(
      'a column naming the titration run of each row (replicate runs of the study): whole numbers 1, 2, … kept, other labels numbered in the order they first appear',
    ),
  moreIntensities: z
    .array(column)
    .max(20)
    .default([])
    .describe(
      'further intensity (or I0/I) columns, one per replicate run: the intensity column is run 1, these runs 2, 3, … at the same concentrations',
    ),
});

/** A spectrum matrix (a CSV or a JCAMP-DX file): a wavelength column and one column per sample, its concentration from the header or typed. */
export const spectrumMappingSchema = z.object({
  layout: z.literal('spectrum'),
  wavelength: column,
  samples: z
    .array(z.object({ column, concentration: z.number().finite().min(0, 'cannot be negative (mol/L)') }))
    .describe('the spectra used, each with its quencher concentration in mol/L'),
  reduction: z.discriminatedUnion('kind', [
    z
      .object({ kind: z.literal('window'), start: z.number().finite(), end: z.number().finite() })
      .describe('trapezoid integral over [start, end] nm'),
    z
      .object({ kind: z.literal('wavelength'), at: z.number().finite() })
      .describe('intensity at one wavelength, nm (linear interpolation)'),
  ]),
  baseline: z
    .object({ start: z.number().finite(), end: z.number().finite() })
    .nullable()
    .default(null)
    .describe(
      'a region without emission, nm: its mean intensity (trapezoid integral / width) is subtracted from each spectrum before the reduction',
    ),
});

export const uploadMappingSchema = z
  .discriminatedUnion('layout', [seriesMappingSchema, spectrumMappingSchema])
  .meta({ id: 'UploadMapping' });
export type UploadMapping = z.infer<typeof uploadMappingSchema>;
export type SeriesMapping = z.infer<typeof seriesMappingSchema>;
export type SpectrumMapping = z.infer<typeof spectrumMappingSchema>;

export const uploadParamsSchema = z.object({
  labId: z.string().uuid('must be a lab id'),
  studyId: z.string().uuid('must be a study id'),
  uploadId: z.string().uuid('must be an upload id'),
});

/**
 * Questions a chemist would ask of points whose concentration unit may be wrong. They do not
 * refuse the file: applying it needs each one acknowledged (the person has checked the unit).
 */
export const uploadQuestionCodes = ['concentration_above_1_molar', 'ksv_below_1_per_molar'] as const;
export type UploadQuestionCode = (typeof uploadQuestionCodes)[number];
export const uploadQuestionSchema = z
  .object({ code: z.enum(uploadQuestionCodes), message: z.string() })
  .meta({ id: 'UploadQuestion' });
export type UploadQuestion = z.infer<typeof uploadQuestionSchema>;

export const previewUploadSchema = z.object({ mapping: uploadMappingSchema }).meta({ id: 'PreviewUpload' });
export const applyUploadSchema = z
  .object({
    version: z.number().int().min(0),
    mapping: uploadMappingSchema,
    mode: z.enum(['replace', 'append']).default('replace'),
    acknowledged: z
      .array(z.enum(uploadQuestionCodes))
      .default([])
      .describe("the preview's questions the person has checked; apply is refused while one is open"),
  })
  .meta({ id: 'ApplyUpload' });
export type ApplyUploadInput = z.input<typeof applyUploadSchema>;

const problemSchema = z.object({
  row: z.number().int().nullable(),
  column: z.string().nullable(),
  message: z.string(),
});

export const uploadPreviewSchema = z
  .object({
    upload: uploadSummarySchema,
    format: z.string().describe('what was read: delimiter, decimal mark, sheet'),
    headers: z.array(z.string()),
    rows: z
      .array(z.array(z.string()))
      .describe(
        'the first rows of the parsed table (at most 200, fewer for a wide table; cells cut at 200 characters)',
      ),
    rowCount: z.number().int().describe('data rows in the whole table'),
    mapping: uploadMappingSchema.nullable(),
    points: z.array(studyPointInputSchema).describe('the first 200 points the mapping gives'),
    pointCount: z.number().int().describe('points the mapping gives in all'),
    problems: z.array(problemSchema),
    warnings: z.array(z.string()),
    questions: z
      .array(uploadQuestionSchema)
      .describe('what these points make doubtful (for instance above 1 M); each must be acknowledged on apply'),
  })
  .meta({ id: 'UploadPreview' });
export type UploadPreview = z.infer<typeof uploadPreviewSchema>;
