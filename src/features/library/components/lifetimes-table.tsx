import { useState } from 'react';
import type { LifetimeRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { describeError } from '@/lib/form-errors';
import { useUpdateLifetime } from '../api/update-lifetime';
import { LifetimeDependents } from './lifetime-dependents';
import { formatLifetime, solventName } from './library-format';

interface LifetimesTableProps {
  labId: string;
  compoundId: string;
  lifetimes: LifetimeRecord[];
  mayEdit: (record: LifetimeRecord) => boolean;
  canCurate: boolean;
  onDelete: (record: LifetimeRecord) => void;
}

/** Unquenched lifetimes with their conditions; changing one lists the studies that took their tau0 from it. */
export function LifetimesTable({ labId, compoundId, lifetimes, mayEdit, canCurate, onDelete }: LifetimesTableProps) {
  const [open, setOpen] = useState<string | null>(null);
  if (lifetimes.length === 0) return <EmptyState title="No lifetimes yet.">Studies can take their tau0 from a lifetime entered here.</EmptyState>;
  return (
    <ul className="divide-y divide-paper-200">
      {lifetimes.map((lifetime) => (
        <li key={lifetime.id} className="space-y-2 py-2.5">
          <div className="flex flex-wrap items-center justify-between gap-2 text-body">
            <span>
              <strong className="text-ink-950">{formatLifetime(lifetime.value)}</strong>
              {lifetime.uncertainty !== null && <span> ± {formatLifetime(lifetime.uncertainty)}</span>}
              <span className="ml-2 text-caption text-ink-600">
                {solventName(lifetime.solvent)}, {lifetime.atmosphere}, {lifetime.temperature} K, {lifetime.method}
                {lifetime.source ? `, ${lifetime.source}` : ''}
              </span>
            </span>
            <span className="flex gap-2">
              <Button variant="quiet" onClick={() => setOpen(open === lifetime.id ? null : lifetime.id)}>
                {open === lifetime.id ? 'Close' : 'Studies and changes'}
              </Button>
              {canCurate && <Button variant="quiet" onClick={() => onDelete(lifetime)}>Remove</Button>}
            </span>
          </div>
          {open === lifetime.id && (
            <div className="space-y-2 rounded-md bg-paper-100 p-3">
              {mayEdit(lifetime) && <LifetimeValueEditor labId={labId} compoundId={compoundId} lifetime={lifetime} />}
              <LifetimeDependents labId={labId} compoundId={compoundId} lifetimeId={lifetime.id} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}

function LifetimeValueEditor({ labId, compoundId, lifetime }: { labId: string; compoundId: string; lifetime: LifetimeRecord }) {
  const update = useUpdateLifetime(labId, compoundId);
  const [nanoseconds, setNanoseconds] = useState(String(Number((lifetime.value * 1e9).toPrecision(6))));
  const save = () => update.mutate({ lifetimeId: lifetime.id, value: Number(nanoseconds) * 1e-9, version: lifetime.version });
  return (
    <div className="flex flex-wrap items-end gap-2">
      <TextField label="Corrected lifetime (ns)" inputMode="decimal" value={nanoseconds} onChange={(event) => setNanoseconds(event.target.value)} />
      <Button onClick={save} pending={update.isPending} pendingLabel="Saving…">Save lifetime</Button>
      {update.isError && <FormAlert>{describeError(update.error)}</FormAlert>}
    </div>
  );
}
