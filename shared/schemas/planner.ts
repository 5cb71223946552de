import { z } from 'zod';
import { qualityFlagSchema } from './quality-flag';

const positive = (what: string) =>
  z.number({ error: `${what} must be a number` }).positive(`${what} must be above zero`);

/** A titration to plan; every value SI-coherent (L, mol/L). */
export const titrationPlanInputSchema = z
  .object({
    initialVolume: positive('The starting volume').describe('V0 in the cuvette, L'),
    emitterConcentration: positive('The emitter concentration').describe('mol/L'),
    stockConcentration: positive('The stock concentration').describe('quencher stock, mol/L'),
    targets: z
      .array(z.number().nonnegative('targets must be zero or more'))
      .max(60, 'at most 60 additions')
      .optional()
      .describe('target quencher concentrations in increasing order, mol/L'),
    maximum: positive('The highest concentration').optional().describe('mol/L; with count, evenly spaced targets'),
    count: z.number().int('must be a whole number').min(1).max(60).optional(),
    volumeStep: positive('The pipette step').optional().describe('pipette resolution, L'),
    stockContainsEmitter: z.boolean().default(false),
    quencherName: z.string().trim().max(160).optional().describe('for the exported plan'),
  })
  .refine((input) => (input.targets?.length ?? 0) > 0 || (input.maximum !== undefined && input.count !== undefined), {
    message: 'give target concentrations, or a highest concentration and a number of points',
    path: ['targets'],
  })
  .meta({ id: 'TitrationPlanInput' });

export const titrationStepSchema = z.object({
  target: z.number().describe('mol/L'),
  additionMicrolitres: z.number().describe('stock to add at this step, µL'),
  cumulativeAddedMicrolitres: z.number().describe('µL'),
  totalVolumeMicrolitres: z.number().describe('µL'),
  concentration: z.number().describe('quencher concentration reached, mol/L'),
  emitterConcentration: z.number().describe('emitter concentration after dilution, mol/L'),
});

export const titrationPlanSchema = z
  .object({
    steps: z.array(titrationStepSchema),
    totalDilution: z.number().describe('fraction of the starting volume added, 0-1'),
    flags: z.array(qualityFlagSchema),
  })
  .meta({ id: 'TitrationPlan' });

export type TitrationPlanInput = z.input<typeof titrationPlanInputSchema>;
export type TitrationPlanResult = z.infer<typeof titrationPlanSchema>;
