import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { z } from 'zod';
import { fromMicroseconds, fromNanoseconds, TIME_UNITS, toMicroseconds, toNanoseconds } from '@shared/units/units';
import { atmospheres, lifetimeInputSchema } from '@shared/schemas/library-measurements';
import type { LifetimeRecord, LifetimeValues } from '@shared/schemas/library-measurements';
import { useSaveMeasurement } from '../api/save-measurement';
import { solventOptions } from './library-format';
import { MeasurementForm, type MeasurementFormSpec } from './measurement-form';

// People read lifetimes in ns or µs; the API takes seconds, converted here with the engine's unit helpers.
const formSchema = lifetimeInputSchema.omit({ value: true, uncertainty: true }).extend({
  amount: z.number({ error: 'must be a number' }).gt(0, 'must be above 0'),
  spread: z.number({ error: 'must be a number' }).min(0, 'must not be negative').optional(),
  unit: z.enum(['ns', 'µs']),
});
type LifetimeFormValues = z.output<typeof formSchema>;

// Twelve significant figures drop the binary noise of the scaling (0.85 µs is stored as 8.5e-7 s,
// not 8.499999999999999e-7).
const toSeconds = (value: number, unit: 'ns' | 'µs') =>
  Number((unit === 'ns' ? fromNanoseconds(value) : fromMicroseconds(value)).toPrecision(12));

const lifetimeForm: MeasurementFormSpec<LifetimeFormValues, LifetimeValues> = {
  names: { add: 'Add a lifetime', edit: 'Edit the lifetime' },
  submitLabel: 'Save lifetime',
  columns: 4,
  resolver: zodResolver(formSchema) as Resolver<LifetimeFormValues>,
  fields: [
    { name: 'amount', label: 'Lifetime', input: 'number' },
    { name: 'spread', label: 'Uncertainty (1 s.d.)', input: 'number' },
    {
      name: 'unit',
      label: 'Unit',
      input: 'select',
      options: [
        { value: 'ns', label: 'ns' },
        { value: 'µs', label: 'µs' },
      ],
    },
    { name: 'temperature', label: 'Temperature (K)', input: 'number' },
    { name: 'solvent', label: 'Solvent', input: 'select', options: solventOptions },
    {
      name: 'atmosphere',
      label: 'Atmosphere',
      input: 'select',
      options: atmospheres.map((value) => ({ value, label: value })),
    },
    { name: 'method', label: 'Method', input: 'text', placeholder: 'TCSPC, transient absorption…' },
    { name: 'source', label: 'Source', input: 'text' },
  ],
  toBody: ({ amount, spread, unit, ...rest }) => ({
    ...rest,
    value: toSeconds(amount, unit),
    uncertainty: spread === undefined ? null : toSeconds(spread, unit),
  }),
  serverPaths: { value: 'amount', uncertainty: 'spread' },
  clearAfterAdd: ['amount', 'spread'],
};

// A record opens in the unit it reads best in (ns below 1 µs), with the same numbers the table shows.
function valuesOf(record: LifetimeRecord) {
  const unit = record.value < TIME_UNITS.us ? ('ns' as const) : ('µs' as const);
  const inUnit = (seconds: number) =>
    Number((unit === 'ns' ? toNanoseconds(seconds) : toMicroseconds(seconds)).toPrecision(6));
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
  const save = useSaveMeasurement(labId, compoundId, 'lifetimes');
  return (
    <MeasurementForm
      spec={lifetimeForm}
      editing={existing !== undefined}
      pending={save.isPending}
      defaultValues={
        existing
          ? valuesOf(existing)
          : { unit: 'ns', solvent: defaultSolvent, atmosphere: 'argon', temperature: 298.15, method: '', source: '' }
      }
      save={(body) =>
        save.mutateAsync(existing ? { id: existing.id, body: { ...body, version: existing.version } } : { body })
      }
      onSaved={onSaved}
      onCancel={onCancel}
    />
  );
}
