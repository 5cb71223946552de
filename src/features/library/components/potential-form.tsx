import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { potentialInputSchema, potentialKinds } from '@shared/schemas/library-measurements';
import type { RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { showServerErrors } from '@/lib/form-errors';
import { useAddPotential } from '../api/add-potential';
import { useUpdatePotential } from '../api/update-potential';
import { toNumber } from './form-number';
import { coupleLabels, kindLabels, referenceOptions, solventOptions } from './library-format';

const fields = ['couple', 'value', 'reference', 'solvent', 'electrolyte', 'kind', 'source', 'notes'] as const;

interface PotentialFormProps {
  labId: string;
  compoundId: string;
  defaultSolvent: string;
  /** Given: the form edits this record (sending its version) instead of adding one. */
  existing?: RedoxPotentialRecord;
  onDone?: () => void;
}

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

/** Enter (or correct) a ground-state potential exactly as reported: against whichever reference it was measured. */
export function PotentialForm({ labId, compoundId, defaultSolvent, existing, onDone }: PotentialFormProps) {
  const add = useAddPotential(labId, compoundId);
  const update = useUpdatePotential(labId, compoundId);
  const form = useForm({
    resolver: zodResolver(potentialInputSchema),
    defaultValues: existing
      ? valuesOf(existing)
      : {
          couple: 'oxidation' as const,
          reference: 'SCE',
          solvent: defaultSolvent,
          kind: 'half-wave' as const,
          electrolyte: '',
          source: '',
          notes: '',
        },
  });
  const { errors } = form.formState;
  const onError = (error: Error) => showServerErrors(error, form.setError, fields);
  const onSubmit = form.handleSubmit((values) =>
    existing
      ? update.mutate(
          { ...values, potentialId: existing.id, version: existing.version },
          { onSuccess: onDone, onError },
        )
      : add.mutate(values, {
          // An empty string clears the input; the schema then asks for a number again.
          onSuccess: () => form.reset({ ...form.getValues(), value: '' as unknown as number, source: '', notes: '' }),
          onError,
        }),
  );
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={existing ? 'Edit the redox potential' : 'Add a redox potential'}
      className="grid gap-3 sm:grid-cols-3"
    >
      <SelectField
        label="Couple"
        options={Object.entries(coupleLabels).map(([value, label]) => ({ value, label }))}
        error={errors.couple?.message}
        {...form.register('couple')}
      />
      <TextField
        label="Potential (V)"
        inputMode="decimal"
        error={errors.value?.message}
        {...form.register('value', { setValueAs: toNumber })}
      />
      <SelectField
        label="Reference electrode"
        options={referenceOptions}
        error={errors.reference?.message}
        {...form.register('reference')}
      />
      <SelectField
        label="Solvent"
        options={solventOptions}
        error={errors.solvent?.message}
        {...form.register('solvent')}
      />
      <SelectField
        label="Kind of wave"
        options={potentialKinds.map((kind) => ({ value: kind, label: kindLabels[kind] }))}
        error={errors.kind?.message}
        {...form.register('kind')}
      />
      <TextField
        label="Supporting electrolyte"
        placeholder="0.1 M Bu4NPF6"
        error={errors.electrolyte?.message}
        {...form.register('electrolyte')}
      />
      <TextField
        label="Source (DOI or notebook page)"
        className="sm:col-span-2"
        error={errors.source?.message}
        {...form.register('source')}
      />
      <TextField label="Notes" error={errors.notes?.message} {...form.register('notes')} />
      <div className="space-y-2 sm:col-span-3">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        {add.isSuccess && !errors.root && (
          <FormAlert tone="good">Potential saved; it is shown in the lab&apos;s display reference above.</FormAlert>
        )}
        <div className="flex gap-2">
          <Button type="submit" pending={add.isPending || update.isPending} pendingLabel="Saving…">
            {existing ? 'Save changes' : 'Save potential'}
          </Button>
          {existing && (
            <Button type="button" variant="quiet" onClick={onDone}>
              Cancel
            </Button>
          )}
        </div>
      </div>
    </form>
  );
}
