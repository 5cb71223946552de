import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { e00FromWavelength, EngineError, MAX_WAVELENGTH_NM, MIN_WAVELENGTH_NM } from '@shared/engine';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { useAddEnergy } from '../api/add-energy';
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

/** Enter E00 in eV, or as a wavelength in nm that the engine converts. */
export function EnergyForm({ labId, compoundId }: { labId: string; compoundId: string }) {
  const add = useAddEnergy(labId, compoundId);
  const form = useForm({ resolver: zodResolver(formSchema), defaultValues: { unit: 'eV' as const, method: '', source: '' } });
  const { errors } = form.formState;
  const [amount, unit] = useWatch({ control: form.control, name: ['amount', 'unit'] });
  const onSubmit = form.handleSubmit(({ amount, unit, method, source }) =>
    add.mutate(
      { ...(unit === 'eV' ? { value: amount } : { wavelength: amount }), method, source: source || null },
      {
        onSuccess: () => form.reset({ ...form.getValues(), amount: '' as unknown as number }),
        onError: (error) => {
          const renamed = error instanceof ApiError
            ? new ApiError(error.status, error.code, error.message, error.details.map((d) => ({ ...d, path: d.path.replace(/body\.(value|wavelength)/, 'body.amount') })))
            : error;
          showServerErrors(renamed, form.setError, ['amount', 'method', 'source']);
        },
      },
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add E00" className="grid gap-3 sm:grid-cols-4">
      <TextField label="E00" inputMode="decimal" hint={preview(amount, unit)} error={errors.amount?.message} {...form.register('amount', { setValueAs: toNumber })} />
      <SelectField label="Entered as" options={[{ value: 'eV', label: 'energy (eV)' }, { value: 'nm', label: 'wavelength (nm)' }]} {...form.register('unit')} />
      <TextField label="How it was obtained" placeholder="emission onset at 77 K" error={errors.method?.message} {...form.register('method')} />
      <TextField label="Source" error={errors.source?.message} {...form.register('source')} />
      <div className="space-y-2 sm:col-span-4">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <Button type="submit" pending={add.isPending} pendingLabel="Saving…">Save E00</Button>
      </div>
    </form>
  );
}
