import { useState } from 'react';
import type { EnergyRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { EnergyForm } from './energy-form';
import { formatElectronvolts } from './library-format';

interface EnergiesTableProps {
  labId: string;
  compoundId: string;
  energies: EnergyRecord[];
  mayEdit: (record: EnergyRecord) => boolean;
  canCurate: boolean;
  onDelete: (record: EnergyRecord) => void;
}

/** E00 values, newest last; the most recent one feeds the excited-state potentials and driving forces. */
export function EnergiesTable({ labId, compoundId, energies, mayEdit, canCurate, onDelete }: EnergiesTableProps) {
  const [editing, setEditing] = useState<string | null>(null);
  if (energies.length === 0)
    return <EmptyState title="No E00 yet.">Enter it in eV or as a wavelength in nm.</EmptyState>;
  return (
    <ul className="divide-y divide-paper-200" aria-label="E00 values">
      {energies.map((energy) => (
        <li key={energy.id} className="space-y-2 py-2">
          <div className="flex flex-wrap items-center justify-between gap-2 text-body">
            <span>
              <strong className="text-ink-950">{formatElectronvolts(energy.value, false)}</strong>
              <span className="ml-2 text-caption text-ink-600">
                {energy.wavelength ? `from ${energy.wavelength} nm, ` : ''}
                {energy.method}
                {energy.source ? `, ${energy.source}` : ''}
                {energy.createdByName ? `; entered by ${energy.createdByName}` : ''}
              </span>
            </span>
            <span className="flex gap-2">
              {mayEdit(energy) && (
                <Button
                  variant="quiet"
                  onClick={() => setEditing(editing === energy.id ? null : energy.id)}
                  aria-label={`${editing === energy.id ? 'Close' : 'Edit'} E00 ${energy.value.toFixed(2)} eV`}
                  aria-expanded={editing === energy.id}
                >
                  {editing === energy.id ? 'Close' : 'Edit'}
                </Button>
              )}
              {canCurate && (
                <Button
                  variant="quiet"
                  onClick={() => onDelete(energy)}
                  aria-label={`Remove E00 ${energy.value.toFixed(2)} eV`}
                >
                  Remove
                </Button>
              )}
            </span>
          </div>
          {editing === energy.id && (
            <div className="rounded-md bg-paper-100 p-3">
              <EnergyForm labId={labId} compoundId={compoundId} existing={energy} onDone={() => setEditing(null)} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
