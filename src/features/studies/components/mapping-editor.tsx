import type { UploadMapping } from '@shared/schemas/study-uploads';
import { concentrationUnits, timeUnits, volumeUnits } from '@shared/schemas/study-uploads';
import { unitLabel, type Unit } from '@shared/units/units';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { SpectrumSamplesEditor } from './spectrum-samples-editor';

type Series = Extract<UploadMapping, { layout: 'series' }>;
const ROLES: Array<[keyof Series & string, string]> = [
  ['concentration', 'Concentration column'],
  ['intensity', 'Intensity or I0/I column'],
  ['lifetime', 'Lifetime column'],
  ['absorbanceExcitation', 'A at λex column'],
  ['absorbanceEmission', 'A at λem column'],
  ['volumeAdded', 'Volume added column'],
  ['uncertainty', 'Uncertainty column'],
  ['run', 'Run column (replicate runs)'],
];

/** Which column holds what, in which unit; or, for a spectrum matrix, how each sample is reduced to one intensity. */
export function MappingEditor({
  headers,
  mapping,
  onChange,
}: {
  headers: string[];
  mapping: UploadMapping;
  onChange: (next: UploadMapping) => void;
}) {
  const columns = [
    { value: '', label: '— none —' },
    ...headers.map((header, i) => ({ value: String(i), label: `${i + 1}: ${header}` })),
  ];
  if (mapping.layout === 'spectrum') {
    const reduction = mapping.reduction;
    return (
      <div className="flex flex-wrap items-end gap-3">
        <p className="w-full text-body">
          Spectra: {mapping.samples.length} of {headers.length - 1} have a quencher concentration (read from the file or
          typed below).
        </p>
        <SpectrumSamplesEditor headers={headers} mapping={mapping} onChange={onChange} />
        <SelectField
          label="Reduce each spectrum by"
          value={reduction.kind}
          options={[
            { value: 'window', label: 'integrating over a window' },
            { value: 'wavelength', label: 'reading one wavelength' },
          ]}
          onChange={(event) =>
            onChange({
              ...mapping,
              reduction:
                event.target.value === 'window' ? { kind: 'window', start: 0, end: 0 } : { kind: 'wavelength', at: 0 },
            })
          }
        />
        {reduction.kind === 'window' ? (
          <>
            <TextField
              label="From (nm)"
              type="number"
              value={reduction.start}
              onChange={(event) =>
                onChange({ ...mapping, reduction: { ...reduction, start: Number(event.target.value) } })
              }
            />
            <TextField
              label="To (nm)"
              type="number"
              value={reduction.end}
              onChange={(event) =>
                onChange({ ...mapping, reduction: { ...reduction, end: Number(event.target.value) } })
              }
            />
          </>
        ) : (
          <TextField
            label="At (nm)"
            type="number"
            value={reduction.at}
            onChange={(event) =>
              onChange({ ...mapping, reduction: { kind: 'wavelength', at: Number(event.target.value) } })
            }
          />
        )}
        <BaselineFields mapping={mapping} onChange={onChange} />
      </div>
    );
  }
  const unitSelect = (
    label: string,
    key: 'concentrationUnit' | 'lifetimeUnit' | 'volumeUnit',
    units: readonly Unit[],
  ) => (
    <SelectField
      label={label}
      value={mapping[key] ?? ''}
      options={[
        // A header without a unit leaves the concentration unit open until the user chooses one.
        ...(mapping[key] === null ? [{ value: '', label: '— choose —' }] : []),
        ...units.map((unit) => ({ value: unit, label: unitLabel(unit) })),
      ]}
      onChange={(event) => onChange({ ...mapping, [key]: event.target.value || null } as UploadMapping)}
    />
  );
  return (
    <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
      {ROLES.map(([key, label]) => (
        <SelectField
          key={key}
          label={label}
          value={mapping[key] === null ? '' : String(mapping[key])}
          options={key === 'concentration' ? columns.slice(1) : columns}
          onChange={(event) =>
            onChange({
              ...mapping,
              [key]: event.target.value === '' ? null : Number(event.target.value),
            } as UploadMapping)
          }
        />
      ))}
      {unitSelect('Concentration unit', 'concentrationUnit', concentrationUnits)}
      {unitSelect('Lifetime unit', 'lifetimeUnit', timeUnits)}
      {unitSelect('Volume unit', 'volumeUnit', volumeUnits)}
      <label className="flex items-center gap-2 self-end pb-2 text-body font-bold text-ink-900">
        <input
          type="checkbox"
          checked={mapping.intensityIsRatio}
          onChange={(event) => onChange({ ...mapping, intensityIsRatio: event.target.checked })}
        />
        Column holds I0/I ratios
      </label>
      <fieldset className="col-span-2 md:col-span-4">
        <legend className="text-body font-bold text-ink-900">
          Further runs: one intensity column each (the intensity column above is run 1)
        </legend>
        <div className="flex flex-wrap gap-x-4 gap-y-1">
          {headers.map((header, i) => {
            const chosen = mapping.moreIntensities.includes(i);
            const run = chosen ? mapping.moreIntensities.indexOf(i) + 2 : null;
            return (
              <label key={i} className="flex items-center gap-2 text-body text-ink-900">
                <input
                  type="checkbox"
                  checked={chosen}
                  disabled={i === mapping.concentration || i === mapping.intensity}
                  onChange={(event) =>
                    onChange({
                      ...mapping,
                      moreIntensities: event.target.checked
                        ? [...mapping.moreIntensities, i]
                        : mapping.moreIntensities.filter((column) => column !== i),
                    })
                  }
                />
                {`${i + 1}: ${header}`}
                {run !== null && ` (run ${run})`}
              </label>
            );
          })}
        </div>
      </fieldset>
    </div>
  );
}

type Spectrum = Extract<UploadMapping, { layout: 'spectrum' }>;

/** An optional region without emission whose mean intensity is taken off every spectrum. */
function BaselineFields({ mapping, onChange }: { mapping: Spectrum; onChange: (next: UploadMapping) => void }) {
  const { baseline } = mapping;
  return (
    <div className="flex w-full flex-wrap items-end gap-3">
      <label className="flex items-center gap-2 pb-2 text-body font-bold text-ink-900">
        <input
          type="checkbox"
          checked={baseline !== null}
          onChange={(event) => onChange({ ...mapping, baseline: event.target.checked ? { start: 0, end: 0 } : null })}
        />
        Subtract a baseline
      </label>
      {baseline && (
        <>
          <TextField
            label="Baseline from (nm)"
            type="number"
            value={baseline.start}
            onChange={(event) => onChange({ ...mapping, baseline: { ...baseline, start: Number(event.target.value) } })}
          />
          <TextField
            label="Baseline to (nm)"
            type="number"
            value={baseline.end}
            onChange={(event) => onChange({ ...mapping, baseline: { ...baseline, end: Number(event.target.value) } })}
          />
          <p className="pb-2 text-caption text-ink-500">
            Choose a region where the sample does not emit; its mean is taken off each spectrum.
          </p>
        </>
      )}
    </div>
  );
}
