import type { DecayModel } from '@shared/schemas/decays';
import { ChoiceField } from '@/components/choice-field';

const COMPONENT_CHOICES = (['1', '2', '3'] as const).map((value) => ({ value, label: value }));
const METHOD_CHOICES = [
  { value: 'auto', label: 'automatic' },
  { value: 'reconvolution', label: 'reconvolution' },
  { value: 'tail', label: 'tail fit' },
] as const;
const ESTIMATOR_CHOICES = [
  { value: 'poisson', label: 'Poisson likelihood' },
  { value: 'least-squares', label: 'weighted least squares' },
] as const;

/** Number of exponentials, reconvolution or tail, estimator and start channel of a decay fit. */
export function DecayModelPicker({ model, onChange }: { model: DecayModel; onChange: (model: DecayModel) => void }) {
  return (
    <div className="space-y-1">
      <div className="grid gap-3 sm:grid-cols-4">
        <ChoiceField
          label="Exponentials"
          value={String(model.components) as `${DecayModel['components']}`}
          choices={COMPONENT_CHOICES}
          onChange={(components) => onChange({ ...model, components: Number(components) as DecayModel['components'] })}
        />
        <ChoiceField
          label="Fit"
          value={model.method ?? 'auto'}
          choices={METHOD_CHOICES}
          onChange={(method) => onChange({ ...model, method: method === 'auto' ? null : method })}
        />
        <ChoiceField
          label="Estimator"
          value={model.estimator}
          choices={ESTIMATOR_CHOICES}
          onChange={(estimator) => onChange({ ...model, estimator })}
        />
        <label className="flex flex-col gap-1 text-body font-bold text-ink-900">
          Start channel
          <input
            type="number"
            min={0}
            placeholder="automatic"
            className="rounded-md border border-paper-300 bg-white px-2.5 py-1.5 font-normal"
            value={model.startChannel ?? ''}
            onChange={(event) =>
              onChange({
                ...model,
                startChannel: event.target.value === '' ? null : Math.max(0, Math.round(Number(event.target.value))),
              })
            }
          />
        </label>
      </div>
      <p className="text-caption text-ink-600">
        Automatic fit: reconvolution with the instrument response when the set has one, else a tail fit. Channels count
        from 0 (each plot lists the channels it fitted). Left empty, the start channel is 0 for reconvolution and just
        past the peak for a tail fit.
      </p>
    </div>
  );
}
