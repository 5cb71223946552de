import { formatQuantity, UNITS } from '@shared/format';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import type { ScenarioShare } from '@shared/schemas/scenarios';
import { Button } from '@/components/button';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import type { ScenarioFormValues } from './scenario-form-schema';

interface ComponentRowProps {
  index: number;
  kind: 'compound' | 'oxygen';
  register: UseFormRegister<ScenarioFormValues>;
  errors: FieldErrors<ScenarioFormValues>;
  quencherOptions: readonly { value: string; label: string }[];
  /** The saved evaluation of this row, when the scenario has been saved: the studies to pick from. */
  share?: ScenarioShare;
  onRemove: () => void;
}

/** One reaction component: what it is, how much is in the flask, and where its kq comes from. */
export function ComponentRow({ index, kind, register, errors, quencherOptions, share, onRemove }: ComponentRowProps) {
  const rowErrors = errors.components?.[index];
  const studyOptions = [
    { value: '', label: 'Best available (approved first)' },
    ...(share?.candidates ?? []).map((candidate) => ({
      value: candidate.studyId,
      label: `${candidate.title} · ${candidate.status} · kq ${formatQuantity(candidate.kq, UNITS.perMolarPerSecond)}`,
    })),
  ];
  return (
    <fieldset className="grid grid-cols-1 items-start gap-3 sm:grid-cols-2 xl:grid-cols-[9rem_minmax(0,1fr)_8rem_minmax(0,1fr)_auto] border-b border-paper-200 pb-3">
      <legend className="sr-only">Component {index + 1}</legend>
      <SelectField
        label="Kind"
        options={[
          { value: 'compound', label: 'Compound' },
          { value: 'oxygen', label: 'Dissolved O₂' },
        ]}
        {...register(`components.${index}.kind`)}
      />
      {kind === 'compound' ? (
        <SelectField
          label="Compound"
          options={[{ value: '', label: 'Choose…' }, ...quencherOptions]}
          error={rowErrors?.compoundId?.message}
          {...register(`components.${index}.compoundId`)}
        />
      ) : (
        <TextField
          label="kq of O₂ (M⁻¹ s⁻¹)"
          inputMode="decimal"
          error={rowErrors?.manualKq?.message}
          {...register(`components.${index}.manualKq`)}
        />
      )}
      <TextField
        label="In reaction (mM)"
        inputMode="decimal"
        error={rowErrors?.concentrationMillimolar?.message}
        {...register(`components.${index}.concentrationMillimolar`)}
      />
      {kind === 'compound' ? (
        <SelectField label="kq from" options={studyOptions} {...register(`components.${index}.studyId`)} />
      ) : (
        <TextField label="Source of that kq" {...register(`components.${index}.manualKqSource`)} />
      )}
      <Button variant="quiet" className="mt-7" onClick={onRemove} aria-label={`Remove component ${index + 1}`}>
        Remove
      </Button>
    </fieldset>
  );
}
