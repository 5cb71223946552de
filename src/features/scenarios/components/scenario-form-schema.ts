import { z } from 'zod';
import type { Scenario, ScenarioInput } from '@shared/schemas/scenarios';
import { fromMillimolar, fromNanoseconds, toMillimolar, toNanoseconds } from '@shared/units/units';

const decimal = (text: string) => Number(text.trim().replace(',', '.'));
const positiveText = z
  .string()
  .trim()
  .min(1, 'is required')
  .refine((text) => decimal(text) > 0, 'must be a number above zero');

/** The scenario form in bench units: concentrations in mM, tau0 in ns, kq in M^-1 s^-1. */
export const scenarioFormSchema = z.object({
  name: z.string().trim().min(1, 'is required').max(160),
  emitterId: z.string().min(1, 'choose the emitter'),
  solvent: z.string().trim().min(1, 'is required').max(80),
  tau0Nanoseconds: positiveText,
  tau0Source: z.string().trim().max(300),
  notes: z.string().max(4000),
  components: z
    .array(
      z
        .object({
          kind: z.enum(['compound', 'oxygen']),
          compoundId: z.string(),
          concentrationMillimolar: positiveText,
          studyId: z.string(),
          manualKq: z.string().trim(),
          manualKqSource: z.string().trim().max(300),
        })
        .superRefine((row, context) => {
          if (row.kind === 'compound' && !row.compoundId) {
            context.addIssue({ code: 'custom', path: ['compoundId'], message: 'choose the compound' });
          }
          if (row.kind === 'oxygen' && !(decimal(row.manualKq) > 0)) {
            context.addIssue({ code: 'custom', path: ['manualKq'], message: 'give kq for oxygen (M⁻¹ s⁻¹)' });
          }
        }),
    )
    .min(1, 'add at least one component'),
});

export type ScenarioFormValues = z.infer<typeof scenarioFormSchema>;

export const emptyComponent: ScenarioFormValues['components'][number] = {
  kind: 'compound',
  compoundId: '',
  concentrationMillimolar: '',
  studyId: '',
  manualKq: '',
  manualKqSource: '',
};

export function toScenarioInput(form: ScenarioFormValues, version?: number): ScenarioInput {
  return {
    name: form.name,
    emitterId: form.emitterId,
    solvent: form.solvent,
    tau0: fromNanoseconds(decimal(form.tau0Nanoseconds)),
    tau0Source: form.tau0Source,
    notes: form.notes,
    version,
    components: form.components.map((row) => ({
      kind: row.kind,
      compoundId: row.kind === 'compound' ? row.compoundId : null,
      concentration: fromMillimolar(decimal(row.concentrationMillimolar)),
      studyId: row.kind === 'compound' && row.studyId ? row.studyId : null,
      manualKq: row.kind === 'oxygen' ? decimal(row.manualKq) : null,
      manualKqSource: row.kind === 'oxygen' ? row.manualKqSource : null,
    })),
  };
}

const trim = (value: number) => String(Number(value.toPrecision(6)));

export function toScenarioForm(scenario: Scenario): ScenarioFormValues {
  return {
    name: scenario.name,
    emitterId: scenario.emitter.id,
    solvent: scenario.solvent,
    tau0Nanoseconds: trim(toNanoseconds(scenario.tau0)),
    tau0Source: scenario.tau0Source,
    notes: scenario.notes,
    components: scenario.shares.map((share) => ({
      kind: share.kind,
      compoundId: share.compoundId ?? '',
      concentrationMillimolar: trim(toMillimolar(share.concentration)),
      studyId: share.kqSource?.kind === 'study' && share.kqSource.chosen === 'by-you' ? share.kqSource.studyId : '',
      manualKq: share.kqSource?.kind === 'manual' && share.kq ? String(share.kq) : '',
      manualKqSource: share.kqSource?.kind === 'manual' ? share.kqSource.note : '',
    })),
  };
}
