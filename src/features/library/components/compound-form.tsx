import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { compoundInputSchema, emissiveStates } from '@shared/schemas/library';
import type { CompoundInput, CompoundValues } from '@shared/schemas/library';
import { compoundRoleHints } from '@shared/schemas/compound-role';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { showServerErrors } from '@/lib/form-errors';
import { roleHintLabels } from './library-format';
import { toNumber } from './form-number';
import { fieldsOf } from '@/lib/form-field';

const fields = [
  'name',
  'roleHint',
  'smiles',
  'formula',
  'emissiveState',
  'tripletEnergy',
  'tripletEnergySource',
  'charge',
  'notes',
] as const;

interface CompoundFormProps {
  initial?: Partial<CompoundInput>;
  submitLabel: string;
  pending: boolean;
  /** Resolves when saved; rejects with the API error, which lands beside the fields. */
  onSave: (values: CompoundValues) => Promise<unknown>;
}

/** Name, role and identity of a compound, and for emitters the character of the emissive state and triplet energy. */
export function CompoundForm({ initial, submitLabel, pending, onSave }: CompoundFormProps) {
  const form = useForm({
    resolver: zodResolver(compoundInputSchema),
    defaultValues: {
      name: '',
      roleHint: 'photocatalyst' as const,
      smiles: '',
      formula: '',
      notes: '',
      charge: 0,
      tripletEnergySource: '',
      ...initial,
    },
  });
  const { errors } = form.formState;
  const field = fieldsOf(form);
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await onSave(values);
      if (!initial) form.reset();
    } catch (error) {
      showServerErrors(error, form.setError, fields);
    }
  });
  const stateOptions = [
    { value: '', label: 'not stated' },
    ...emissiveStates.map((value) => ({ value, label: value })),
  ];
  return (
    <form onSubmit={onSubmit} noValidate aria-label={submitLabel} className="grid gap-3 sm:grid-cols-3">
      <TextField label="Name or code" {...field('name')} />
      <SelectField
        label="Used as"
        options={compoundRoleHints.map((value) => ({ value, label: roleHintLabels[value] }))}
        {...field('roleHint')}
      />
      <TextField label="Formula" {...field('formula')} />
      <TextField label="SMILES" className="sm:col-span-2" {...field('smiles')} />
      <TextField
        label="Charge"
        hint="Before electron transfer; sets the Coulomb term"
        inputMode="numeric"
        {...field('charge', { setValueAs: toNumber })}
      />
      <SelectField
        label="Emissive state"
        options={stateOptions}
        {...field('emissiveState', { setValueAs: (value) => value || null })}
      />
      <TextField
        label="Triplet energy (eV)"
        inputMode="decimal"
        {...field('tripletEnergy', {
          setValueAs: (value) => (value === '' || value === null ? null : toNumber(value)),
        })}
      />
      <TextField label="Triplet energy source" {...field('tripletEnergySource')} />
      <TextField label="Notes" className="sm:col-span-3" {...field('notes')} />
      <div className="space-y-2 sm:col-span-3">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <Button type="submit" pending={pending} pendingLabel="Saving…">
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
