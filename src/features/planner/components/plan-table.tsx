import type { TitrationPlanResult } from '@shared/schemas/planner';
import { fromMicrolitres, toMicromolar, toMillilitres, toMillimolar } from '@shared/units/units';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

const format = (value: number, digits = 4) =>
  Number(value.toPrecision(digits)).toLocaleString('en', { maximumFractionDigits: 6 });

/** One row per addition, in µL, mL, mM and µM: what goes on the bench sheet. */
export function PlanTable({ plan }: { plan: TitrationPlanResult }) {
  return (
    <TableScroll label="Plan, scroll sideways">
      <table className="w-full text-left text-body">
        <caption className="sr-only">Additions of quencher stock</caption>
        <TableHead
          look="ruled"
          columns={[
            'Step',
            'Target [Q] (mM)',
            'Add stock (µL)',
            'Added so far (µL)',
            'Volume (mL)',
            '[Q] reached (mM)',
            'Emitter (µM)',
          ]}
        />
        <tbody>
          {plan.steps.map((step, index) => (
            <tr key={index} className="border-b border-paper-200 tabular-nums">
              <td className="py-1.5 pr-3 font-bold">{index + 1}</td>
              <td className="pr-3">{format(toMillimolar(step.target))}</td>
              <td className="pr-3 font-bold text-ink-950">{format(step.additionMicrolitres)}</td>
              <td className="pr-3">{format(step.cumulativeAddedMicrolitres)}</td>
              <td className="pr-3">{format(toMillilitres(fromMicrolitres(step.totalVolumeMicrolitres)))}</td>
              <td className="pr-3">{format(toMillimolar(step.concentration))}</td>
              <td>{format(toMicromolar(step.emitterConcentration))}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}
