import { z } from 'zod';

const uuid = (what: string) => z.string().uuid(`must be ${what}`);

export const scenarioComponentInputSchema = z
  .object({
    kind: z.enum(['compound', 'oxygen']).default('compound'),
    compoundId: uuid('a compound id').nullable().optional(),
    concentration: z
      .number({ error: 'must be a number' })
      .positive('must be above zero')
      .describe('concentration in the reaction, mol/L'),
    studyId: uuid('a study id').nullable().optional().describe('the study whose kq to use; empty picks the best'),
    manualKq: z
      .number()
      .positive('must be above zero')
      .nullable()
      .optional()
      .describe('M^-1 s^-1, dissolved oxygen only'),
    manualKqSource: z.string().trim().max(300).nullable().optional(),
  })
  .superRefine((component, context) => {
    if (component.kind === 'compound' && !component.compoundId) {
      context.addIssue({ code: 'custom', path: ['compoundId'], message: 'is required for a compound' });
    }
    if (component.kind === 'oxygen' && component.compoundId) {
      context.addIssue({ code: 'custom', path: ['compoundId'], message: 'must be empty for dissolved oxygen' });
    }
  });

export const scenarioInputSchema = z
  .object({
    name: z.string().trim().min(1, 'is required').max(160),
    emitterId: uuid('a compound id'),
    solvent: z.string().trim().min(1, 'is required').max(80),
    tau0: z.number({ error: 'must be a number' }).positive('must be above zero').describe('unquenched lifetime, s'),
    tau0Source: z.string().trim().max(300).default(''),
    notes: z.string().max(4000).default(''),
    components: z.array(scenarioComponentInputSchema).min(1, 'needs at least one component').max(20),
    version: z.number().int().optional().describe('the version you edited; a stale one gets 409'),
  })
  .meta({ id: 'ScenarioInput' });

export const scenarioParamsSchema = z.object({
  labId: uuid('a lab id'),
  scenarioId: uuid('a scenario id'),
});

const kqSourceSchema = z.union([
  z.object({
    kind: z.literal('study'),
    studyId: z.string(),
    title: z.string(),
    status: z.string(),
    solvent: z.string().nullable(),
    chosen: z.enum(['by-you', 'best-available']),
  }),
  z.object({ kind: z.literal('manual'), note: z.string() }),
]);

export const kqCandidateSchema = z.object({
  studyId: z.string(),
  title: z.string(),
  status: z.string(),
  kq: z.number(),
  solvent: z.string().nullable(),
  updatedAt: z.string(),
});

export const scenarioShareSchema = z.object({
  componentId: z.string(),
  kind: z.enum(['compound', 'oxygen']),
  compoundId: z.string().nullable(),
  label: z.string(),
  concentration: z.number().describe('mol/L'),
  kq: z.number().nullable().describe('M^-1 s^-1'),
  kqStandardError: z.number().nullable(),
  kqSource: kqSourceSchema.nullable(),
  candidates: z.array(kqCandidateSchema),
  pseudoFirstOrderRate: z.number().nullable().describe('kq c, s^-1'),
  fraction: z.number().nullable().describe('share of excited emitter intercepted, 0-1'),
});

export const scenarioSchema = z
  .object({
    id: z.string(),
    name: z.string(),
    emitter: z.object({ id: z.string(), name: z.string() }),
    solvent: z.string(),
    tau0: z.number(),
    tau0Source: z.string(),
    notes: z.string(),
    version: z.number().int(),
    createdBy: z.string().nullable(),
    updatedAt: z.string(),
    shares: z.array(scenarioShareSchema),
    unquenched: z.number().describe('share that decays without being quenched, 0-1'),
    totalDecayRate: z.number().describe('1/tau0 + sum kq c, s^-1'),
    missing: z.array(z.object({ componentId: z.string(), label: z.string(), compoundId: z.string().nullable() })),
    caution: z.string(),
  })
  .meta({ id: 'Scenario' });

export const scenarioSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  emitterName: z.string(),
  solvent: z.string(),
  componentCount: z.number().int(),
  updatedAt: z.string(),
});
export const scenarioListSchema = z
  .object({ items: z.array(scenarioSummarySchema), total: z.number().int() })
  .meta({ id: 'ScenarioList' });

export type ScenarioInput = z.input<typeof scenarioInputSchema>;
export type Scenario = z.infer<typeof scenarioSchema>;
export type ScenarioShare = z.infer<typeof scenarioShareSchema>;
export type ScenarioList = z.infer<typeof scenarioListSchema>;
