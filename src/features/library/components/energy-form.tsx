import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { e00FromWavelength, EngineError, MAX_WAVELENGTH_NM, MIN_WAVELENGTH_NM } from '@shared/engine';
import type { EnergyRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { useAddEnergy } from '../api/add-energy';
import { useUpdateEnergy } from '../api/update-energy';
import { toNumber } from './form-number';

// One number and its unit; the server stores eV and keeps the wavelength (hc/e = 1239.84198 eV nm, CODATA).
const formSchema = z
  .object({
    amount: z.number({ error: 'must be a number' }).gt(0, 'must be above 0'),
    unit: z.enum(['eV', 'nm']),
    method: z.string().trim().min(1, 'must say how E00 was obtained').max(120),
    source: z.string().max(400).optional(),
  })
  .refine((input) => input.unit === 'eV' || (input.amount >= MIN_WAVELENGTH_NM && input.amount <= MAX_WAVELENGTH_NM), {
    message: `must lie between ${MIN_WAVELENGTH_NM} and ${MAX_WAVELENGTH_NM} nm`,
    path: ['amount'],
  });

function preview(amount: unknown, unit: string): string | undefined {
  if (unit !== 'nm' || typeof amount !== 'number') return undefined;
  try {
    return `= ${e00FromWavelength(amount).toFixed(3)} eV`;
  } catch (error) {
    return error instanceof EngineError ? undefined : String(error);
  }
}

const valuesOf = (record: EnergyRecord) => ({
  amount: record.wavelength ?? record.value,
  unit: record.wavelength === null ? ('eV' as const) : ('nm' as const),
  method: record.method,
  source: record.source ?? '',
});

/** Enter (or, given `existing`, correct) E00 in eV, or as a wavelength in nm that the engine converts. */
export function EnergyForm({
  labId,
  compoundId,
  existing,
  onDone,
}: {
  labId: string;
  compoundId: string;
  existing?: EnergyRecord;
  onDone?: () => void;
}) {
  const add = useAddEnergy(labId, compoundId);
  const update = useUpdateEnergy(labId, compoundId);
  const form = useForm({
    resolver: zodResolver(formSchema),
    defaultValues: existing ? valuesOf(existing) : { unit: 'eV' as const, method: '', source: '' },
  });
  const { errors } = form.formState;
  const [amount, unit] = useWatch({ control: form.control, name: ['amount', 'unit'] });
  const onError = (error: Error) => {
    const renamed =
      error instanceof ApiError
        ? new ApiError(
            error.status,
            error.code,
            error.message,
            error.details.map((d) => ({ ...d, path: d.path.replace(/body\.(value|wavelength)/, 'body.amount') })),
          )
        : error;
    showServerErrors(renamed, form.setError, ['amount', 'method', 'source']);
  };
  const onSubmit = form.handleSubmit(({ amount, unit, method, source }) => {
    // Sent in eV, the server forgets the old wavelength; sent in nm, it converts and keeps it.
    const values = { ...(unit === 'eV' ? { value: amount } : { wavelength: amount }), method, source: source || null };
    if (existing)
      update.mutate({ ...values, energyId: existing.id, version: existing.version }, { onSuccess: onDone, onError });
    else
      add.mutate(values, {
        onSuccess: () => form.reset({ ...form.getValues(), amount: '' as unknown as number }),
        onError,
      });
  });
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={existing ? 'Edit E00' : 'Add E00'}
      className="grid gap-3 sm:grid-cols-4"
    >
      <TextField
        label="E00"
        inputMode="decimal"
        hint={preview(amount, unit)}
        error={errors.amount?.message}
        {...form.register('amount', { setValueAs: toNumber })}
      />
      <SelectField
        label="Entered as"
        options={[
          { value: 'eV', label: 'energy (eV)' },
          { value: 'nm', label: 'wavelength (nm)' },
        ]}
        {...form.register('unit')}
      />
      <TextField
        label="How it was obtained"
        placeholder="emission onset at 77 K"
        error={errors.method?.message}
        {...form.register('method')}
      />
      <TextField label="Source" error={errors.source?.message} {...form.register('source')} />
      <div className="space-y-2 sm:col-span-4">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <div className="flex gap-2">
          <Button type="submit" pending={add.isPending || update.isPending} pendingLabel="Saving…">
            {existing ? 'Save changes' : 'Save E00'}
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
