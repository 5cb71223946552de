import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { z } from 'zod';
import { EngineError } from '@shared/engine/core/engine-error';
import {
  e00FromWavelength,
  MAX_WAVELENGTH_NM,
  MIN_WAVELENGTH_NM,
} from '@shared/engine/electrochem/e00-from-wavelength';
import type { EnergyInput, EnergyRecord } from '@shared/schemas/library-measurements';
import { useSaveMeasurement } from '../api/save-measurement';
import { MeasurementForm, type MeasurementFormSpec } from './measurement-form';

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
type EnergyFormValues = z.output<typeof formSchema>;

function preview({ amount, unit }: Partial<EnergyFormValues>): string | undefined {
  if (unit !== 'nm' || typeof amount !== 'number') return undefined;
  try {
    return `= ${e00FromWavelength(amount).toFixed(3)} eV`;
  } catch (error) {
    return error instanceof EngineError ? undefined : String(error);
  }
}

const energyForm: MeasurementFormSpec<EnergyFormValues, EnergyInput> = {
  names: { add: 'Add E00', edit: 'Edit E00' },
  submitLabel: 'Save E00',
  columns: 4,
  resolver: zodResolver(formSchema) as Resolver<EnergyFormValues>,
  fields: [
    { name: 'amount', label: 'E00', input: 'number', hint: preview },
    {
      name: 'unit',
      label: 'Entered as',
      input: 'select',
      options: [
        { value: 'eV', label: 'energy (eV)' },
        { value: 'nm', label: 'wavelength (nm)' },
      ],
    },
    { name: 'method', label: 'How it was obtained', input: 'text', placeholder: 'emission onset at 77 K' },
    { name: 'source', label: 'Source', input: 'text' },
  ],
  // Sent in eV, the server forgets the old wavelength; sent in nm, it converts and keeps it.
  toBody: ({ amount, unit, method, source }) => ({
    ...(unit === 'eV' ? { value: amount } : { wavelength: amount }),
    method,
    source: source || null,
  }),
  serverPaths: { value: 'amount', wavelength: 'amount' },
  clearAfterAdd: ['amount'],
};

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
  const save = useSaveMeasurement(labId, compoundId, 'energies');
  return (
    <MeasurementForm
      spec={energyForm}
      editing={existing !== undefined}
      pending={save.isPending}
      defaultValues={existing ? valuesOf(existing) : { unit: 'eV', method: '', source: '' }}
      save={(body) =>
        save.mutateAsync(existing ? { id: existing.id, body: { ...body, version: existing.version } } : { body })
      }
      onSaved={onDone}
      onCancel={onDone}
    />
  );
}
