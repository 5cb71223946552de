import { z } from 'zod';

/** One point of a quenching series. Units: mol/L, s, L; intensity in the instrument's unit (or I0/I). */
export const studyPointInputSchema = z
  .object({
    concentration: z.number().finite().min(0, 'cannot be negative (mol/L)').describe('quencher concentration, mol/L'),
    intensity: z.number().finite().nullable().describe('emission intensity, or I0/I when the study holds ratios'),
    lifetime: z.number().finite().positive('must be above zero (s)').nullable().describe('s'),
    absorbanceExcitation: z.number().finite().nullable().describe('A at the excitation wavelength, 1 cm'),
    absorbanceEmission: z.number().finite().nullable().describe('A at the emission wavelength, 1 cm'),
    volumeAdded: z
      .number()
      .finite()
      .min(0, 'cannot be negative (L)')
      .nullable()
      .describe('total stock added before this reading, L'),
    uncertainty: z
      .number()
      .finite()
      .positive('must be above zero')
      .nullable()
      .describe('1-sigma of the intensity (or ratio)'),
    excluded: z.boolean().default(false),
    exclusionReason: z.string().trim().max(500).nullable().default(null),
    series: z
      .number()
      .int('a whole number')
      .min(1, 'runs are numbered from 1')
      .max(99)
      .default(1)
      .describe('the titration run (replicate) the reading belongs to; each run is normalised by its own I0'),
  })
  .superRefine((point, context) => {
    if (point.excluded && !point.exclusionReason) {
      context.addIssue({ code: 'custom', path: ['exclusionReason'], message: 'say why the point is left out' });
    }
  })
  .meta({ id: 'StudyPointInput' });
export type StudyPointInput = z.input<typeof studyPointInputSchema>;
export type StudyPointValues = z.output<typeof studyPointInputSchema>;

/** The ten values a point holds: the one list every service copies a point by. */
export const POINT_VALUE_KEYS = [
  'concentration',
  'intensity',
  'lifetime',
  'absorbanceExcitation',
  'absorbanceEmission',
  'volumeAdded',
  'uncertainty',
  'excluded',
  'exclusionReason',
  'series',
] as const satisfies ReadonlyArray<keyof StudyPointValues>;

/** A point with only its concentration: every measured value empty, not left out. */
export const pointAt = (concentration: number): StudyPointValues => ({
  concentration,
  intensity: null,
  lifetime: null,
  absorbanceExcitation: null,
  absorbanceEmission: null,
  volumeAdded: null,
  uncertainty: null,
  excluded: false,
  exclusionReason: null,
  series: 1,
});

/** A point's ten values (from a model row, a plain row or an input), nothing else. */
export function pointValues(point: Pick<StudyPointValues, (typeof POINT_VALUE_KEYS)[number]>): StudyPointValues {
  const values: Partial<Record<(typeof POINT_VALUE_KEYS)[number], unknown>> = {};
  for (const key of POINT_VALUE_KEYS) values[key] = point[key];
  return values as StudyPointValues;
}

export const replacePointsSchema = z
  .object({
    version: z.number().int().min(0).describe('the study version you edited; a stale one gets 409'),
    points: z.array(studyPointInputSchema).max(5000),
  })
  .meta({ id: 'ReplacePoints' });
export type ReplacePointsInput = z.input<typeof replacePointsSchema>;

/** Where a lifetime came from: a kept decay set, named by its file ("from decay <file>"). */
export const decaySourceSchema = z
  .object({ decaySetId: z.string().uuid(), fileName: z.string() })
  .meta({ id: 'DecaySource' });

export const studyPointSchema = z
  .object({
    id: z.string().uuid(),
    position: z.number().int(),
    concentration: z.number(),
    intensity: z.number().nullable(),
    lifetime: z.number().nullable(),
    absorbanceExcitation: z.number().nullable(),
    absorbanceEmission: z.number().nullable(),
    volumeAdded: z.number().nullable(),
    uncertainty: z.number().nullable(),
    excluded: z.boolean(),
    exclusionReason: z.string().nullable(),
    series: z.number().int().describe('the titration run (replicate) the reading belongs to'),
    uploadId: z.string().nullable(),
    lifetimeUncertainty: z.number().nullable().describe('s, one standard error (lifetimes fitted from a decay)'),
    lifetimeSource: decaySourceSchema.nullable().describe('the decay set the lifetime was fitted from'),
    corrected: z
      .object({
        concentration: z.number(),
        intensity: z.number().nullable(),
        innerFilterFactor: z.number().nullable(),
        dilutionFactor: z.number().nullable(),
      })
      .nullable()
      .describe('values after the switched-on corrections; null when none applies'),
  })
  .meta({ id: 'StudyPoint' });
export type StudyPoint = z.infer<typeof studyPointSchema>;
