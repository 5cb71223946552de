import { planTitration } from '@shared/engine';
import type { z } from 'zod';
import type { titrationPlanInputSchema, TitrationPlanResult } from '@shared/schemas/planner';
import { titled, UNITS } from '@shared/format';
import { csvTable } from '../../lib/csv-cells';

type PlanInput = z.infer<typeof titrationPlanInputSchema>;

export function computeTitrationPlan(input: PlanInput): TitrationPlanResult {
  return planTitration(input);
}

const round = (value: number, digits: number) => Number(value.toPrecision(digits));

/** The plan as CSV for the bench: one row per addition, in units a chemist pipettes with. */
export function titrationPlanCsv(input: PlanInput, plan: TitrationPlanResult): string {
  const header = [
    'step',
    titled('target [Q]', UNITS.millimolar),
    titled('add stock', UNITS.microlitre),
    titled('stock added so far', UNITS.microlitre),
    titled('total volume', UNITS.microlitre),
    titled('[Q] reached', UNITS.millimolar),
    titled('emitter after dilution', UNITS.micromolar),
  ];
  const rows = plan.steps.map((step, index) => [
    String(index + 1),
    String(round(step.target * 1e3, 6)),
    String(round(step.additionMicrolitres, 5)),
    String(round(step.cumulativeAddedMicrolitres, 5)),
    String(round(step.totalVolumeMicrolitres, 6)),
    String(round(step.concentration * 1e3, 6)),
    String(round(step.emitterConcentration * 1e6, 6)),
  ]);
  // Settings as name/value pairs, each value in a cell of its own (so it is neutralised like any cell).
  const preamble = [
    ['# Halflight titration plan'],
    ['# quencher', input.quencherName ?? 'not named'],
    [`# ${titled('starting volume', UNITS.millilitre)}`, input.initialVolume * 1e3],
    [`# ${titled('emitter', UNITS.micromolar)}`, input.emitterConcentration * 1e6],
    [`# ${titled('stock', UNITS.millimolar)}`, input.stockConcentration * 1e3],
    ['# stock also holds the emitter', input.stockContainsEmitter ? 'yes' : 'no'],
    ['# total dilution (%)', round(plan.totalDilution * 100, 4)],
  ];
  return csvTable([...preamble, header, ...rows]);
}
