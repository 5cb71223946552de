import { useState } from 'react';
import type { LifetimeRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FormAlert } from '@/components/form-alert';
import { LifetimeDependents } from './lifetime-dependents';
import { LifetimeForm } from './lifetime-form';
import { formatLifetime, solventName } from './library-format';

interface LifetimesTableProps {
  labId: string;
  compoundId: string;
  userId: string;
  defaultSolvent: string;
  lifetimes: LifetimeRecord[];
  mayEdit: (record: LifetimeRecord) => boolean;
  canCurate: boolean;
  onDelete: (record: LifetimeRecord) => void;
  onStudyRefitted?: () => void;
}

type Open = { id: string; view: 'edit' | 'studies' | 'saved' } | null;

/** Unquenched lifetimes with their conditions; after a change the studies that took their tau0 from it are listed. */
export function LifetimesTable({
  labId,
  compoundId,
  userId,
  defaultSolvent,
  lifetimes,
  mayEdit,
  canCurate,
  onDelete,
  onStudyRefitted,
}: LifetimesTableProps) {
  const [open, setOpen] = useState<Open>(null);
  if (lifetimes.length === 0)
    return <EmptyState title="No lifetimes yet.">Studies can take their τ0 from a lifetime entered here.</EmptyState>;
  const toggle = (id: string, view: 'edit' | 'studies') =>
    setOpen(open?.id === id && open.view === view ? null : { id, view });
  return (
    <ul className="divide-y divide-paper-200" aria-label="Lifetimes">
      {lifetimes.map((lifetime) => {
        const view = open?.id === lifetime.id ? open.view : null;
        return (
          <li key={lifetime.id} className="space-y-2 py-2.5">
            <div className="flex flex-wrap items-center justify-between gap-2 text-body">
              <span>
                <strong className="text-ink-950">{formatLifetime(lifetime.value)}</strong>
                {lifetime.uncertainty !== null && (
                  <span> ± {formatLifetime(lifetime.uncertainty, lifetime.value)}</span>
                )}
                <span className="ml-2 text-caption text-ink-600">
                  {solventName(lifetime.solvent)}, {lifetime.atmosphere}, {lifetime.temperature} K, {lifetime.method}
                  {lifetime.source ? `, ${lifetime.source}` : ''}
                  {lifetime.createdByName ? `; entered by ${lifetime.createdByName}` : ''}
                </span>
              </span>
              <span className="flex gap-2">
                {mayEdit(lifetime) && (
                  <Button variant="quiet" onClick={() => toggle(lifetime.id, 'edit')}>
                    {view === 'edit' ? 'Close' : 'Edit'}
                  </Button>
                )}
                <Button variant="quiet" onClick={() => toggle(lifetime.id, 'studies')}>
                  {view === 'studies' ? 'Hide studies' : 'Studies using it'}
                </Button>
                {canCurate && (
                  <Button variant="quiet" onClick={() => onDelete(lifetime)}>
                    Remove
                  </Button>
                )}
              </span>
            </div>
            {view === 'edit' && (
              <div className="rounded-md bg-paper-100 p-3">
                <LifetimeForm
                  labId={labId}
                  compoundId={compoundId}
                  defaultSolvent={defaultSolvent}
                  existing={lifetime}
                  onSaved={() => setOpen({ id: lifetime.id, view: 'saved' })}
                  onCancel={() => setOpen(null)}
                />
              </div>
            )}
            {(view === 'studies' || view === 'saved') && (
              <div className="space-y-2 rounded-md bg-paper-100 p-3">
                {view === 'saved' && (
                  <FormAlert tone="good">
                    Lifetime saved. Studies keep their own τ0 until you refit them below.
                  </FormAlert>
                )}
                <LifetimeDependents
                  labId={labId}
                  compoundId={compoundId}
                  lifetimeId={lifetime.id}
                  userId={userId}
                  onStudyRefitted={onStudyRefitted}
                />
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
