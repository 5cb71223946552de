import { useState } from 'react';
import type { Pathway } from '@shared/schemas/driving-force';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { EmptyState } from '@/components/empty-state';
import { SelectField } from '@/components/select-field';
import { useCompounds } from '../api/get-compounds';
import { DrivingForcePanel } from './driving-force-panel';
import { solventOptions } from './library-format';

/**
 * Pick a partner and a solvent and read the driving force of the pair; the compound on screen
 * is the emitter when it is one, else the quencher.
 */
export function PairDrivingForce({
  labId,
  compound,
  defaultSolvent,
}: {
  labId: string;
  compound: CompoundDetail;
  defaultSolvent: string;
}) {
  const asEmitter = compound.roleHint !== 'quencher';
  const partners = useCompounds(labId, { roleHint: asEmitter ? 'quencher' : 'photocatalyst', pageSize: 100 });
  const options = (partners.data?.items ?? []).filter((item) => item.id !== compound.id);
  const [partnerId, setPartnerId] = useState('');
  const [solvent, setSolvent] = useState(defaultSolvent);
  const [pinned, setPinned] = useState<Pathway | null>(null);
  const chosen = partnerId || options[0]?.id || '';
  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label={asEmitter ? 'Quencher' : 'Emitter'}
          options={options.map((item) => ({ value: item.id, label: item.name }))}
          value={chosen}
          onChange={(event) => setPartnerId(event.target.value)}
        />
        <SelectField
          label="Solvent of the reaction"
          options={solventOptions}
          value={solvent}
          onChange={(event) => setSolvent(event.target.value)}
        />
      </div>
      {chosen ? (
        <DrivingForcePanel
          labId={labId}
          emitterId={asEmitter ? compound.id : chosen}
          quencherId={asEmitter ? chosen : compound.id}
          solvent={solvent}
          pinned={pinned}
          onPin={setPinned}
        />
      ) : (
        <EmptyState title={`No ${asEmitter ? 'quencher' : 'emitter'} in the library yet.`}>
          Add one to read the driving force of the pair.
        </EmptyState>
      )}
      <p className="text-caption text-ink-500">
        Pinning here is for reading only; a study keeps its own expected mechanism.
      </p>
    </div>
  );
}
