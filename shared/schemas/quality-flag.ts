import { z } from 'zod';

/**
 * A warning (or a refusal) the engine attaches to a result — a Stern–Volmer fit, a titration plan:
 * a stable code, plain words for people, what to check and what to do next. One schema for every result
 * that has flags (results stored before `whatToDo` existed have none).
 */
export const qualityFlagSchema = z
  .object({
    code: z.string(),
    severity: z.enum(['warning', 'error']),
    title: z.string(),
    explanation: z.string(),
    whatToCheck: z.array(z.string()),
    whatToDo: z
      .string()
      .optional()
      .describe('the next step in one sentence; every Stern–Volmer and decay flag has one'),
    detail: z.string().optional(),
  })
  .meta({ id: 'QualityFlag' });
