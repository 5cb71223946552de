import { z } from 'zod';

export const healthSchema = z
  .object({
    status: z.enum(['ok', 'degraded']),
    version: z.string().describe('Halflight application version'),
    uptimeSeconds: z.number().describe('Seconds since the API process started'),
    time: z.string().describe('Server time, ISO 8601'),
    database: z.object({
      status: z.enum(['up', 'down']),
      latencyMs: z.number().nullable().describe('Round trip of one query, milliseconds'),
      serverVersion: z.string().nullable(),
      embedded: z.boolean().describe('True when Halflight started its own PostgreSQL cluster'),
      migrationsApplied: z.number().int().nullable(),
      message: z.string().optional(),
    }),
  })
  .meta({ id: 'Health' });

export type Health = z.infer<typeof healthSchema>;
