import { z } from 'zod';
import { compoundRefSchema, studySettingsSchema, studyStatusSchema } from './studies';
import { studyFitSchema } from './study-fits';
import { decaySourceSchema, studyPointSchema } from './study-points';

export const uploadSummarySchema = z
  .object({
    id: z.string().uuid(),
    fileName: z.string(),
    mediaType: z.string(),
    size: z.number().int().describe('bytes'),
    sha256: z.string(),
    parseStatus: z.enum(['parsed', 'failed', 'applied']),
    problem: z.string().nullable().describe('why parsing failed, naming row and column'),
    reading: z
      .string()
      .nullable()
      .describe('how the applied file was read (spectrum window or wavelength, baseline, concentration unit)'),
    uploadedBy: z.string().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: 'UploadSummary' });
export type UploadSummary = z.infer<typeof uploadSummarySchema>;

export const reviewEntrySchema = z
  .object({
    id: z.string().uuid(),
    action: z.enum(['submit', 'approve', 'return', 'comment']),
    comment: z.string(),
    author: z.string().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: 'ReviewEntry' });
export type ReviewEntry = z.infer<typeof reviewEntrySchema>;

export const studyDetailSchema = studySettingsSchema
  .extend({
    id: z.string().uuid(),
    emitter: compoundRefSchema,
    quencher: compoundRefSchema,
    solventLabel: z.string(),
    status: studyStatusSchema,
    revision: z.number().int(),
    previousRevisionId: z.string().nullable(),
    nextRevisionId: z.string().nullable(),
    ownerId: z.string().nullable(),
    ownerName: z.string(),
    version: z.number().int(),
    createdAt: z.string(),
    updatedAt: z.string(),
    points: z.array(studyPointSchema),
    latestFit: studyFitSchema.nullable(),
    fitProblem: z.string().nullable().describe('why the newest points could not be fitted'),
    tau0Source: decaySourceSchema.nullable().describe('the decay set whose zero-concentration decays gave tau0'),
    uploads: z.array(uploadSummarySchema),
    reviews: z.array(reviewEntrySchema),
  })
  .meta({ id: 'StudyDetail' });
export type StudyDetail = z.infer<typeof studyDetailSchema>;

export const reviewCommentSchema = z
  .object({ comment: z.string().trim().max(4000).default('') })
  .meta({ id: 'ReviewComment' });
export const returnStudySchema = z
  .object({ comment: z.string().trim().min(1, 'say what should change').max(4000) })
  .meta({ id: 'ReturnStudy' });

export const historyEntrySchema = z
  .object({
    id: z.string(),
    action: z.string(),
    actor: z.string().nullable(),
    createdAt: z.string(),
    details: z.record(z.string(), z.unknown()),
  })
  .meta({ id: 'StudyHistoryEntry' });
export const studyHistorySchema = z.object({ events: z.array(historyEntrySchema) }).meta({ id: 'StudyHistory' });
export type StudyHistory = z.infer<typeof studyHistorySchema>;
