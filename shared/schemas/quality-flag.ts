import { z } from 'zod';

/**
 * A warning (or a refusal) the engine attaches to a result — a Stern–Volmer fit, a titration plan:
 * a stable code, plain words for people and what to check. One schema for every result that has flags.
 */
export const qualityFlagSchema = z
  .object({
    code: z.string(),
    severity: z.enum(['warning', 'error']),
    title: z.string(),
    explanation: z.string(),
    whatToCheck: z.array(z.string()),
    detail: z.string().optional(),
  })
  .meta({ id: 'QualityFlag' });
