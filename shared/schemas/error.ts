import { z } from 'zod';

/** One bad field of a request: where it is and what was wrong. */
export const fieldIssueSchema = z
  .object({
    path: z.string().describe('Dotted location of the field, e.g. "body.email" or "query.page"'),
    message: z.string(),
  })
  .meta({ id: 'FieldIssue' });

/** The single error shape every API route answers with. */
export const apiErrorSchema = z
  .object({
    error: z.object({
      code: z.string().describe('Stable machine-readable code, e.g. "validation_failed"'),
      message: z.string().describe('Plain-language explanation for a person'),
      details: z.array(fieldIssueSchema).optional(),
    }),
  })
  .meta({ id: 'ApiError' });

export type FieldIssue = z.infer<typeof fieldIssueSchema>;
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
