import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { potentialInputSchema, potentialKinds } from '@shared/schemas/library-measurements';
import type { PotentialValues, RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { useSaveMeasurement } from '../api/save-measurement';
import { coupleLabels, kindLabels, referenceOptions, solventOptions } from './library-format';
import { MeasurementForm, type MeasurementFormSpec } from './measurement-form';

const potentialForm: MeasurementFormSpec<PotentialValues, PotentialValues> = {
  names: { add: 'Add a redox potential', edit: 'Edit the redox potential' },
  submitLabel: 'Save potential',
  columns: 3,
  resolver: zodResolver(potentialInputSchema) as Resolver<PotentialValues>,
  fields: [
    {
      name: 'couple',
      label: 'Couple',
      input: 'select',
      options: Object.entries(coupleLabels).map(([value, label]) => ({ value, label })),
    },
    { name: 'value', label: 'Potential (V)', input: 'number' },
    { name: 'reference', label: 'Reference electrode', input: 'select', options: referenceOptions },
    { name: 'solvent', label: 'Solvent', input: 'select', options: solventOptions },
    {
      name: 'kind',
      label: 'Kind of wave',
      input: 'select',
      options: potentialKinds.map((kind) => ({ value: kind, label: kindLabels[kind] })),
    },
    { name: 'electrolyte', label: 'Supporting electrolyte', input: 'text', placeholder: '0.1 M Bu4NPF6' },
    { name: 'source', label: 'Source (DOI or notebook page)', input: 'text', className: 'sm:col-span-2' },
    { name: 'notes', label: 'Notes', input: 'text' },
  ],
  toBody: (values) => values,
  clearAfterAdd: ['value', 'source', 'notes'],
  savedNote: "Potential saved; it is shown in the lab's display reference above.",
};

const valuesOf = (record: RedoxPotentialRecord) => ({
  couple: record.couple,
  value: record.value,
  reference: record.reference,
  solvent: record.solvent,
  kind: record.kind,
  electrolyte: record.electrolyte ?? '',
  source: record.source ?? '',
  notes: record.notes,
});

interface PotentialFormProps {
  labId: string;
  compoundId: string;
  defaultSolvent: string;
  /** Given: the form edits this record (sending its version) instead of adding one. */
  existing?: RedoxPotentialRecord;
  onDone?: () => void;
}

/** Enter (or correct) a ground-state potential exactly as reported: against whichever reference it was measured. */
export function PotentialForm({ labId, compoundId, defaultSolvent, existing, onDone }: PotentialFormProps) {
  const save = useSaveMeasurement(labId, compoundId, 'potentials');
  return (
    <MeasurementForm
      spec={potentialForm}
      editing={existing !== undefined}
      pending={save.isPending}
      defaultValues={
        existing
          ? valuesOf(existing)
          : { couple: 'oxidation', reference: 'SCE', solvent: defaultSolvent, kind: 'half-wave', electrolyte: '' }
      }
      save={(body) =>
        save.mutateAsync(existing ? { id: existing.id, body: { ...body, version: existing.version } } : { body })
      }
      onSaved={onDone}
      onCancel={onDone}
    />
  );
}
