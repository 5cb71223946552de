import { useState } from 'react';
import type { CompoundInput } from '@shared/schemas/library';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { Button } from '@/components/button';
import { ConfirmedAction } from '@/components/confirmed-action';
import { FormAlert } from '@/components/form-alert';
import { Tag } from '@/components/tag';
import { TextLink } from '@/components/text-link';
import { describeError } from '@/lib/form-errors';
import { useDeleteCompound } from '../api/delete-compound';
import { useUpdateCompound } from '../api/update-compound';
import { CompoundForm } from './compound-form';
import { roleHintLabels } from './library-format';
import { paths } from '@/lib/paths';

interface CompoundHeaderProps {
  labId: string;
  labName: string;
  isDemo: boolean;
  compound: CompoundDetail;
  mayEdit: boolean;
  canCurate: boolean;
  onDeleted: () => void;
}

/** Name, role and identity of the compound, with editing for its author and curators. */
export function CompoundHeader({
  labId,
  labName,
  isDemo,
  compound,
  mayEdit,
  canCurate,
  onDeleted,
}: CompoundHeaderProps) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateCompound(labId, compound.id);
  const remove = useDeleteCompound(labId, compound.id);
  const facts = [
    compound.formula,
    compound.emissiveState && `emissive state ${compound.emissiveState}`,
    compound.tripletEnergy !== null && `triplet energy ${compound.tripletEnergy.toFixed(2)} eV`,
    compound.charge !== 0 && `charge ${compound.charge > 0 ? '+' : ''}${compound.charge}`,
  ]
    .filter(Boolean)
    .join(' · ');
  return (
    <header className="space-y-2">
      <p className="flex items-center gap-2 text-caption tracking-wide text-ink-500">
        <TextLink to={paths.library(labId)}>Library</TextLink> {labName} {isDemo && <Tag tone="demo">Demo</Tag>}
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-display font-black text-ink-950">{compound.name}</h1>
        <Tag>{roleHintLabels[compound.roleHint]}</Tag>
      </div>
      {facts && <p className="text-body text-ink-700">{facts}</p>}
      {compound.smiles && <p className="break-all font-mono text-caption text-ink-600">{compound.smiles}</p>}
      {compound.notes && <p className="max-w-3xl text-body text-ink-700">{compound.notes}</p>}
      <div className="flex flex-wrap gap-2">
        {mayEdit && (
          <Button variant="quiet" onClick={() => setEditing(!editing)}>
            {editing ? 'Stop editing' : 'Edit compound'}
          </Button>
        )}
        {canCurate && (
          <ConfirmedAction
            ask="Remove compound"
            confirm={`Remove ${compound.name} and its measurements`}
            pending={remove.isPending}
            pendingLabel="Removing…"
            onConfirm={() => remove.mutate(compound.version, { onSuccess: onDeleted })}
          />
        )}
      </div>
      {remove.isError && <FormAlert>{describeError(remove.error)}</FormAlert>}
      {editing && (
        <div id="add-compound" className="rounded-card border border-paper-200 bg-paper-50 p-4">
          <CompoundForm
            initial={{
              name: compound.name,
              roleHint: compound.roleHint,
              smiles: compound.smiles ?? '',
              formula: compound.formula ?? '',
              notes: compound.notes,
              emissiveState: compound.emissiveState as CompoundInput['emissiveState'],
              tripletEnergy: compound.tripletEnergy,
              tripletEnergySource: compound.tripletEnergySource ?? '',
              charge: compound.charge,
            }}
            submitLabel="Save compound"
            pending={update.isPending}
            onSave={async (values) => {
              await update.mutateAsync({ ...values, version: compound.version });
              setEditing(false);
            }}
          />
        </div>
      )}
    </header>
  );
}
