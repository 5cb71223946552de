import type { DecayModel } from '@shared/schemas/decays';
import { SelectField } from '@/components/select-field';

/** Number of exponentials, reconvolution or tail, estimator and start channel of a decay fit. */
export function DecayModelPicker({ model, onChange }: { model: DecayModel; onChange: (model: DecayModel) => void }) {
  return (
    <div className="space-y-1">
      <div className="grid gap-3 sm:grid-cols-4">
        <SelectField
          label="Exponentials"
          value={String(model.components)}
          options={[
            { value: '1', label: '1' },
            { value: '2', label: '2' },
            { value: '3', label: '3' },
          ]}
          onChange={(event) => onChange({ ...model, components: Number(event.target.value) as 1 | 2 | 3 })}
        />
        <SelectField
          label="Fit"
          value={model.method ?? 'auto'}
          options={[
            { value: 'auto', label: 'automatic' },
            { value: 'reconvolution', label: 'reconvolution' },
            { value: 'tail', label: 'tail fit' },
          ]}
          onChange={(event) =>
            onChange({ ...model, method: event.target.value === 'auto' ? null : (event.target.value as 'tail') })
          }
        />
        <SelectField
          label="Estimator"
          value={model.estimator}
          options={[
            { value: 'poisson', label: 'Poisson likelihood' },
            { value: 'least-squares', label: 'weighted least squares' },
          ]}
          onChange={(event) => onChange({ ...model, estimator: event.target.value as DecayModel['estimator'] })}
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
