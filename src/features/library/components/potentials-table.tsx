import { Fragment, useState } from 'react';
import type { RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { coupleLabels, formatVolts, kindLabels, solventName } from './library-format';
import { PotentialForm } from './potential-form';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

interface PotentialsTableProps {
  labId: string;
  compoundId: string;
  defaultSolvent: string;
  potentials: RedoxPotentialRecord[];
  displayReference: string;
  mayEdit: (potential: RedoxPotentialRecord) => boolean;
  canCurate: boolean;
  onDelete: (potential: RedoxPotentialRecord) => void;
}

/** Each potential in the lab's display reference, with the value, reference and source as entered always beside it. */
export function PotentialsTable({
  labId,
  compoundId,
  defaultSolvent,
  potentials,
  displayReference,
  mayEdit,
  canCurate,
  onDelete,
}: PotentialsTableProps) {
  const [editing, setEditing] = useState<string | null>(null);
  if (potentials.length === 0)
    return <EmptyState title="No redox potentials yet.">Add one below, against any reference electrode.</EmptyState>;
  const hasActions = canCurate || potentials.some(mayEdit);
  const cell = 'px-3 py-2 align-top';
  // Said once for the table rather than on every row: it concerns the choice of display reference.
  const advice = potentials
    .flatMap((p) => p.display?.warnings ?? [])
    .find((warning) => warning.code === 'PREFER_FERROCENE_REFERENCE');
  return (
    <div className="space-y-2">
      <TableScroll label="Potentials, scroll sideways">
        <table className="w-full text-body">
          <TableHead
            look="spaced"
            columns={[
              'Couple',
              `vs ${displayReference}`,
              'As entered',
              'Conditions',
              'Source',
              hasActions && <span className="sr-only">Actions</span>,
            ]}
          />
          <tbody>
            {potentials.map((potential) => (
              <Fragment key={potential.id}>
                <tr className="border-t border-paper-200">
                  <td className={`${cell} whitespace-nowrap`}>{coupleLabels[potential.couple]}</td>
                  <td className={cell}>
                    {potential.display ? (
                      <strong className="text-ink-950">{formatVolts(potential.display.value)}</strong>
                    ) : (
                      <span className="text-brick-700">{potential.displayProblem}</span>
                    )}
                    {potential.display?.warnings
                      .filter((warning) => warning.code === 'JUNCTION_POTENTIAL')
                      .map((warning) => (
                        <p key={warning.code} role="note" className="mt-1 max-w-xs text-caption text-brick-700">
                          {warning.message}
                        </p>
                      ))}
                  </td>
                  <td className={`${cell} whitespace-nowrap text-ink-800`}>
                    {formatVolts(potential.value)} vs {potential.reference}
                  </td>
                  <td className={`${cell} text-caption text-ink-700`}>
                    {kindLabels[potential.kind]}, {solventName(potential.solvent)}
                    {potential.electrolyte ? `, ${potential.electrolyte}` : ''}
                  </td>
                  <td className={`${cell} text-caption text-ink-700 [overflow-wrap:anywhere]`}>
                    {potential.source ?? '—'}
                    {potential.createdByName && (
                      <span className="block text-ink-500">entered by {potential.createdByName}</span>
                    )}
                  </td>
                  {hasActions && (
                    <td className={`${cell} whitespace-nowrap text-right`}>
                      <span className="inline-flex gap-2">
                        {mayEdit(potential) && (
                          <Button
                            variant="quiet"
                            onClick={() => setEditing(editing === potential.id ? null : potential.id)}
                            aria-label={`${editing === potential.id ? 'Close' : 'Edit'} ${potential.couple} potential ${potential.value} V`}
                            aria-expanded={editing === potential.id}
                          >
                            {editing === potential.id ? 'Close' : 'Edit'}
                          </Button>
                        )}
                        {canCurate && (
                          <Button
                            variant="quiet"
                            onClick={() => onDelete(potential)}
                            aria-label={`Remove ${potential.couple} potential ${potential.value} V`}
                          >
                            Remove
                          </Button>
                        )}
                      </span>
                    </td>
                  )}
                </tr>
                {editing === potential.id && (
                  <tr>
                    <td colSpan={6} className="rounded-md bg-paper-100 p-3">
                      <PotentialForm
                        labId={labId}
                        compoundId={compoundId}
                        defaultSolvent={defaultSolvent}
                        existing={potential}
                        onDone={() => setEditing(null)}
                      />
                    </td>
                  </tr>
                )}
              </Fragment>
            ))}
          </tbody>
        </table>
      </TableScroll>
      {advice && <p className="text-caption text-ink-600">{advice.message}</p>}
    </div>
  );
}
