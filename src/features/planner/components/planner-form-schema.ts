import { z } from 'zod';
import type { TitrationPlanInput } from '@shared/schemas/planner';
import { fromMicrolitres, fromMicromolar, fromMillilitres, fromMillimolar } from '@shared/units/units';

const amount = (what: string) =>
  z
    .string()
    .trim()
    .min(1, 'is required')
    .transform((text) => Number(text.replace(',', '.')))
    .refine((value) => Number.isFinite(value) && value > 0, `${what} must be a number above zero`);

/**
 * The planner form in bench units (mL, µM, mM, µL); converted to the API's SI units on submit.
 * Decimal commas are accepted, as many instruments and spreadsheets write them.
 */
export const plannerFormSchema = z
  .object({
    initialVolumeMl: amount('The starting volume'),
    emitterMicromolar: amount('The emitter concentration'),
    stockMillimolar: amount('The stock concentration'),
    mode: z.enum(['even', 'targets']),
    maximumMillimolar: z.string().trim(),
    count: z.string().trim(),
    targetsMillimolar: z.string().trim(),
    pipetteStepMicrolitres: z.string().trim(),
    stockContainsEmitter: z.boolean(),
    quencherName: z.string().trim().max(160),
  })
  .superRefine((form, context) => {
    if (form.mode === 'even') {
      if (!(Number(form.maximumMillimolar.replace(',', '.')) > 0)) {
        context.addIssue({ code: 'custom', path: ['maximumMillimolar'], message: 'must be a number above zero' });
      }
      if (!/^\d+$/.test(form.count) || Number(form.count) < 1 || Number(form.count) > 60) {
        context.addIssue({ code: 'custom', path: ['count'], message: 'must be a whole number from 1 to 60' });
      }
    } else if (parseTargets(form.targetsMillimolar).some((value) => !Number.isFinite(value) || value < 0)) {
      context.addIssue({
        code: 'custom',
        path: ['targetsMillimolar'],
        message: 'must be numbers separated by spaces, semicolons or new lines',
      });
    } else if (parseTargets(form.targetsMillimolar).length === 0) {
      context.addIssue({ code: 'custom', path: ['targetsMillimolar'], message: 'needs at least one concentration' });
    }
    if (form.pipetteStepMicrolitres && !(Number(form.pipetteStepMicrolitres.replace(',', '.')) > 0)) {
      context.addIssue({
        code: 'custom',
        path: ['pipetteStepMicrolitres'],
        message: 'must be a number above zero, or empty',
      });
    }
  });

export type PlannerFormInput = z.input<typeof plannerFormSchema>;

/** A sensible start: 2 mL of 10 µM emitter, a 100 mM stock, six additions up to 5 mM. */
export const plannerDefaults: PlannerFormInput = {
  initialVolumeMl: '2.0',
  emitterMicromolar: '10',
  stockMillimolar: '100',
  mode: 'even',
  maximumMillimolar: '5',
  count: '6',
  targetsMillimolar: '',
  pipetteStepMicrolitres: '',
  stockContainsEmitter: false,
  quencherName: '',
};

export type PlannerFormValues = z.output<typeof plannerFormSchema>;

export function parseTargets(text: string): number[] {
  return text
    .split(/[\s;]+/)
    .filter(Boolean)
    .map((entry) => Number(entry.replace(',', '.')));
}

/** Bench units to the API's SI units. */
export function toPlanInput(form: PlannerFormValues): TitrationPlanInput {
  const number = (text: string) => Number(text.replace(',', '.'));
  return {
    initialVolume: fromMillilitres(form.initialVolumeMl),
    emitterConcentration: fromMicromolar(form.emitterMicromolar),
    stockConcentration: fromMillimolar(form.stockMillimolar),
    ...(form.mode === 'even'
      ? { maximum: fromMillimolar(number(form.maximumMillimolar)), count: Number(form.count) }
      : { targets: parseTargets(form.targetsMillimolar).map(fromMillimolar) }),
    ...(form.pipetteStepMicrolitres ? { volumeStep: fromMicrolitres(number(form.pipetteStepMicrolitres)) } : {}),
    stockContainsEmitter: form.stockContainsEmitter,
    ...(form.quencherName ? { quencherName: form.quencherName } : {}),
  };
}
