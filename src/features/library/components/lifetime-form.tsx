import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { fromMicroseconds, fromNanoseconds } from '@shared/engine';
import { atmospheres, lifetimeInputSchema } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { useAddLifetime } from '../api/add-lifetime';
import { solventOptions } from './library-format';
import { toNumber } from './form-number';

// People read lifetimes in ns or µs; the API takes seconds, converted here with the engine's unit helpers.
const formSchema = lifetimeInputSchema.omit({ value: true, uncertainty: true }).extend({
  amount: z.number({ error: 'must be a number' }).gt(0, 'must be above 0'),
  spread: z.number({ error: 'must be a number' }).min(0, 'must not be negative').optional(),
  unit: z.enum(['ns', 'µs']),
});
const toSeconds = (value: number, unit: 'ns' | 'µs') => (unit === 'ns' ? fromNanoseconds(value) : fromMicroseconds(value));

/** Enter an unquenched lifetime with its conditions; studies can take their tau0 from it. */
export function LifetimeForm({ labId, compoundId, defaultSolvent }: { labId: string; compoundId: string; defaultSolvent: string }) {
  const add = useAddLifetime(labId, compoundId);
  const form = useForm({
    resolver: zodResolver(formSchema),
    defaultValues: { unit: 'ns' as const, solvent: defaultSolvent, atmosphere: 'argon' as const, temperature: 298.15, method: '', source: '', notes: '' },
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(({ amount, spread, unit, ...rest }) =>
    add.mutate(
      { ...rest, value: toSeconds(amount, unit), uncertainty: spread === undefined ? null : toSeconds(spread, unit) },
      {
        onSuccess: () => form.reset({ ...form.getValues(), amount: '' as unknown as number, spread: '' as unknown as number }),
        onError: (error) => {
          const renamed = error instanceof ApiError
            ? new ApiError(error.status, error.code, error.message, error.details.map((d) => ({ ...d, path: d.path.replace('body.value', 'body.amount').replace('body.uncertainty', 'body.spread') })))
            : error;
          showServerErrors(renamed, form.setError, ['amount', 'spread', 'solvent', 'atmosphere', 'temperature', 'method', 'source', 'notes']);
        },
      },
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a lifetime" className="grid gap-3 sm:grid-cols-4">
      <TextField label="Lifetime" inputMode="decimal" error={errors.amount?.message} {...form.register('amount', { setValueAs: toNumber })} />
      <TextField label="Uncertainty (1 s.d.)" inputMode="decimal" error={errors.spread?.message} {...form.register('spread', { setValueAs: toNumber })} />
      <SelectField label="Unit" options={[{ value: 'ns', label: 'ns' }, { value: 'µs', label: 'µs' }]} {...form.register('unit')} />
      <TextField label="Temperature (K)" inputMode="decimal" error={errors.temperature?.message} {...form.register('temperature', { setValueAs: toNumber })} />
      <SelectField label="Solvent" options={solventOptions} error={errors.solvent?.message} {...form.register('solvent')} />
      <SelectField label="Atmosphere" options={atmospheres.map((value) => ({ value, label: value }))} error={errors.atmosphere?.message} {...form.register('atmosphere')} />
      <TextField label="Method" placeholder="TCSPC, transient absorption…" error={errors.method?.message} {...form.register('method')} />
      <TextField label="Source" error={errors.source?.message} {...form.register('source')} />
      <div className="space-y-2 sm:col-span-4">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <Button type="submit" pending={add.isPending} pendingLabel="Saving…">Save lifetime</Button>
      </div>
    </form>
  );
}
