import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { fromMicroseconds, fromNanoseconds } from '@shared/engine';
import { atmospheres, lifetimeInputSchema } from '@shared/schemas/library-measurements';
import type { LifetimeRecord } from '@shared/schemas/library-measurements';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { useAddLifetime } from '../api/add-lifetime';
import { useUpdateLifetime } from '../api/update-lifetime';
import { solventOptions } from './library-format';
import { toNumber } from './form-number';

// People read lifetimes in ns or µs; the API takes seconds, converted here with the engine's unit helpers.
const formSchema = lifetimeInputSchema.omit({ value: true, uncertainty: true }).extend({
  amount: z.number({ error: 'must be a number' }).gt(0, 'must be above 0'),
  spread: z.number({ error: 'must be a number' }).min(0, 'must not be negative').optional(),
  unit: z.enum(['ns', 'µs']),
});
// Twelve significant figures drop the binary noise of the scaling (0.85 µs is stored as 8.5e-7 s, not 8.499999999999999e-7).
const toSeconds = (value: number, unit: 'ns' | 'µs') =>
  Number((unit === 'ns' ? fromNanoseconds(value) : fromMicroseconds(value)).toPrecision(12));

// A record opens in the unit it reads best in (ns below 1 µs), with the same numbers the table shows.
function valuesOf(record: LifetimeRecord) {
  const unit = record.value < 1e-6 ? ('ns' as const) : ('µs' as const);
  const scale = unit === 'ns' ? 1e9 : 1e6;
  const inUnit = (seconds: number) => Number((seconds * scale).toPrecision(6));
  return {
    amount: inUnit(record.value),
    spread: record.uncertainty === null ? undefined : inUnit(record.uncertainty),
    unit,
    solvent: record.solvent,
    atmosphere: record.atmosphere,
    temperature: record.temperature,
    method: record.method,
    source: record.source ?? '',
    notes: record.notes,
  };
}

interface LifetimeFormProps {
  labId: string;
  compoundId: string;
  defaultSolvent: string;
  /** Given: the form edits this record (sending its version) instead of adding one. */
  existing?: LifetimeRecord;
  onSaved?: () => void;
  onCancel?: () => void;
}

/** Enter (or correct) an unquenched lifetime with its conditions; studies can take their tau0 from it. */
export function LifetimeForm({ labId, compoundId, defaultSolvent, existing, onSaved, onCancel }: LifetimeFormProps) {
  const add = useAddLifetime(labId, compoundId);
  const update = useUpdateLifetime(labId, compoundId);
  const form = useForm({
    resolver: zodResolver(formSchema),
    defaultValues: existing
      ? valuesOf(existing)
      : {
          unit: 'ns' as const,
          solvent: defaultSolvent,
          atmosphere: 'argon' as const,
          temperature: 298.15,
          method: '',
          source: '',
          notes: '',
        },
  });
  const { errors } = form.formState;
  const onError = (error: Error) => {
    const renamed =
      error instanceof ApiError
        ? new ApiError(
            error.status,
            error.code,
            error.message,
            error.details.map((d) => ({
              ...d,
              path: d.path.replace('body.value', 'body.amount').replace('body.uncertainty', 'body.spread'),
            })),
          )
        : error;
    showServerErrors(renamed, form.setError, [
      'amount',
      'spread',
      'solvent',
      'atmosphere',
      'temperature',
      'method',
      'source',
      'notes',
    ]);
  };
  const onSubmit = form.handleSubmit(({ amount, spread, unit, ...rest }) => {
    const values = {
      ...rest,
      value: toSeconds(amount, unit),
      uncertainty: spread === undefined ? null : toSeconds(spread, unit),
    };
    if (existing)
      update.mutate({ ...values, lifetimeId: existing.id, version: existing.version }, { onSuccess: onSaved, onError });
    else
      add.mutate(values, {
        onSuccess: () =>
          form.reset({ ...form.getValues(), amount: '' as unknown as number, spread: '' as unknown as number }),
        onError,
      });
  });
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={existing ? 'Edit the lifetime' : 'Add a lifetime'}
      className="grid gap-3 sm:grid-cols-4"
    >
      <TextField
        label="Lifetime"
        inputMode="decimal"
        error={errors.amount?.message}
        {...form.register('amount', { setValueAs: toNumber })}
      />
      <TextField
        label="Uncertainty (1 s.d.)"
        inputMode="decimal"
        error={errors.spread?.message}
        {...form.register('spread', { setValueAs: toNumber })}
      />
      <SelectField
        label="Unit"
        options={[
          { value: 'ns', label: 'ns' },
          { value: 'µs', label: 'µs' },
        ]}
        {...form.register('unit')}
      />
      <TextField
        label="Temperature (K)"
        inputMode="decimal"
        error={errors.temperature?.message}
        {...form.register('temperature', { setValueAs: toNumber })}
      />
      <SelectField
        label="Solvent"
        options={solventOptions}
        error={errors.solvent?.message}
        {...form.register('solvent')}
      />
      <SelectField
        label="Atmosphere"
        options={atmospheres.map((value) => ({ value, label: value }))}
        error={errors.atmosphere?.message}
        {...form.register('atmosphere')}
      />
      <TextField
        label="Method"
        placeholder="TCSPC, transient absorption…"
        error={errors.method?.message}
        {...form.register('method')}
      />
      <TextField label="Source" error={errors.source?.message} {...form.register('source')} />
      <div className="space-y-2 sm:col-span-4">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <div className="flex gap-2">
          <Button type="submit" pending={add.isPending || update.isPending} pendingLabel="Saving…">
            {existing ? 'Save changes' : 'Save lifetime'}
          </Button>
          {existing && (
            <Button type="button" variant="quiet" onClick={onCancel}>
              Cancel
            </Button>
          )}
        </div>
      </div>
    </form>
  );
}
