import type { RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { coupleLabels, formatVolts, kindLabels, solventName } from './library-format';

interface PotentialsTableProps {
  potentials: RedoxPotentialRecord[];
  displayReference: string;
  canCurate: boolean;
  onDelete: (potential: RedoxPotentialRecord) => void;
}

/** Each potential in the lab's display reference, with the value, reference and source as entered always beside it. */
export function PotentialsTable({ potentials, displayReference, canCurate, onDelete }: PotentialsTableProps) {
  if (potentials.length === 0) return <EmptyState title="No redox potentials yet.">Add one below, against any reference electrode.</EmptyState>;
  const heading = 'px-3 py-2 text-left text-caption font-bold uppercase text-ink-500';
  const cell = 'px-3 py-2 align-top';
  // Said once for the table rather than on every row: it concerns the choice of display reference.
  const advice = potentials.flatMap((p) => p.display?.warnings ?? []).find((warning) => warning.code === 'PREFER_FERROCENE_REFERENCE');
  return (
    <div className="space-y-2 overflow-x-auto">
      <table className="w-full text-body">
        <thead>
          <tr>
            <th scope="col" className={heading}>Couple</th>
            <th scope="col" className={heading}>vs {displayReference}</th>
            <th scope="col" className={heading}>As entered</th>
            <th scope="col" className={heading}>Conditions</th>
            <th scope="col" className={heading}>Source</th>
            {canCurate && <th scope="col" className={heading}><span className="sr-only">Actions</span></th>}
          </tr>
        </thead>
        <tbody>
          {potentials.map((potential) => (
            <tr key={potential.id} className="border-t border-paper-200">
              <td className={`${cell} whitespace-nowrap`}>{coupleLabels[potential.couple]}</td>
              <td className={cell}>
                {potential.display ? <strong className="text-ink-950">{formatVolts(potential.display.value)}</strong> : <span className="text-brick-700">{potential.displayProblem}</span>}
                {potential.display?.warnings.filter((warning) => warning.code === 'JUNCTION_POTENTIAL').map((warning) => (
                  <p key={warning.code} role="note" className="mt-1 max-w-xs text-caption text-brick-700">{warning.message}</p>
                ))}
              </td>
              <td className={`${cell} whitespace-nowrap text-ink-800`}>{formatVolts(potential.value)} vs {potential.reference}</td>
              <td className={`${cell} text-caption text-ink-700`}>
                {kindLabels[potential.kind]}, {solventName(potential.solvent)}{potential.electrolyte ? `, ${potential.electrolyte}` : ''}
              </td>
              <td className={`${cell} break-all text-caption text-ink-700`}>
                {potential.source ?? '—'}
                {potential.createdByName && <span className="block text-ink-500">entered by {potential.createdByName}</span>}
              </td>
              {canCurate && (
                <td className={`${cell} text-right`}>
                  <Button variant="quiet" onClick={() => onDelete(potential)} aria-label={`Remove ${potential.couple} potential ${potential.value} V`}>Remove</Button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      {advice && <p className="text-caption text-ink-600">{advice.message}</p>}
    </div>
  );
}
