import type { EnergyRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { formatElectronvolts } from './library-format';

/** E00 values, newest last; the most recent one feeds the excited-state potentials and driving forces. */
export function EnergiesTable({ energies, canCurate, onDelete }: { energies: EnergyRecord[]; canCurate: boolean; onDelete: (record: EnergyRecord) => void }) {
  if (energies.length === 0) return <EmptyState title="No E00 yet.">Enter it in eV or as a wavelength in nm.</EmptyState>;
  return (
    <ul className="divide-y divide-paper-200">
      {energies.map((energy) => (
        <li key={energy.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-body">
          <span>
            <strong className="text-ink-950">{formatElectronvolts(energy.value, false)}</strong>
            <span className="ml-2 text-caption text-ink-600">
              {energy.wavelength ? `from ${energy.wavelength} nm, ` : ''}{energy.method}{energy.source ? `, ${energy.source}` : ''}
            </span>
          </span>
          {canCurate && <Button variant="quiet" onClick={() => onDelete(energy)}>Remove</Button>}
        </li>
      ))}
    </ul>
  );
}
