import { z } from 'zod';

/*
 * The mechanism evidence of one study: each piece that exists with what it says and its numbers,
 * the combined verdict with reasons, and the missing pieces with what to add
 * (shared/engine/mechanism/combine-mechanism-evidence.ts).
 */

export const mechanismPieceKindSchema = z.enum(['lifetime', 'temperature', 'wavelength', 'absorption', 'diffusion']);

export const mechanismVerdictSchema = z
  .enum(['dynamic', 'static', 'both', 'two-emitters', 'unclear'])
  .describe('two-emitters: two emitting species or an exciplex')
  .meta({ id: 'MechanismVerdict' });
export type MechanismVerdictValue = z.infer<typeof mechanismVerdictSchema>;

export const mechanismPieceSchema = z
  .object({
    kind: mechanismPieceKindSchema,
    title: z.string(),
    reading: z
      .enum(['dynamic', 'static', 'both', 'two-emitters', 'static-or-long-range', 'neutral', 'unclear'])
      .describe('what this piece says; neutral: consistent with either'),
    summary: z.string().describe('what it says in plain words, with the numbers'),
    numbers: z.array(
      z.object({
        label: z.string(),
        value: z.number(),
        standardError: z.number().nullable(),
        unit: z.string().describe('as people read it, e.g. "M⁻¹ s⁻¹"; empty when unitless'),
      }),
    ),
  })
  .meta({ id: 'MechanismPiece' });
export type MechanismPieceAnswer = z.infer<typeof mechanismPieceSchema>;

export const mechanismEvidenceSchema = z
  .object({
    studyId: z.string().uuid(),
    verdict: mechanismVerdictSchema,
    reasons: z.array(z.string()),
    pieces: z.array(mechanismPieceSchema),
    missing: z.array(z.object({ kind: mechanismPieceKindSchema, title: z.string(), reason: z.string() })),
    series: z
      .object({ studyIds: z.array(z.string().uuid()), temperatures: z.array(z.number()) })
      .nullable()
      .describe(
        'the temperature series the study belongs to (same pair and solvent), when it has 2 or more temperatures',
      ),
    spectrumMatrixId: z.string().uuid().nullable().describe('the spectrum matrix read (the newest)'),
  })
  .meta({ id: 'MechanismEvidence' });
export type MechanismEvidence = z.infer<typeof mechanismEvidenceSchema>;

/**
 * The study's combined verdict before and after a change to its spectra (a matrix or titration
 * analysed again or discarded): the screen says when it moved, and the audit entry keeps both.
 */
export const mechanismVerdictChangeSchema = z
  .object({
    before: mechanismVerdictSchema,
    after: mechanismVerdictSchema,
    reasons: z.array(z.string()).describe('the reasons behind the verdict after the change'),
  })
  .meta({ id: 'MechanismVerdictChange' });
export type MechanismVerdictChange = z.infer<typeof mechanismVerdictChangeSchema>;

/** The few words for a verdict, the same on the screen, in the PDF and in the comparison. */
export const MECHANISM_VERDICT_WORDS: Record<MechanismVerdictValue, string> = {
  dynamic: 'Dynamic (collisional)',
  static: 'Static (ground-state complex)',
  both: 'Static and dynamic',
  'two-emitters': 'Two emitters or an exciplex',
  unclear: 'Unclear',
};

/** What one piece says, in a word or three. */
export const MECHANISM_READING_WORDS: Record<MechanismPieceAnswer['reading'], string> = {
  dynamic: 'Dynamic',
  static: 'Static',
  both: 'Static and dynamic',
  'two-emitters': 'Two emitters',
  'static-or-long-range': 'Static or long range',
  neutral: 'Fits either',
  unclear: 'Unclear',
};
