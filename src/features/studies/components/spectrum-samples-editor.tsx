import { useState } from 'react';
import type { SpectrumMapping } from '@shared/schemas/study-uploads';
import { CONCENTRATION_UNITS, unitLabel } from '@shared/units/units';
import { ConcentrationUnitField } from './concentration-unit-field';
import type { GridConcentrationUnit } from './format';

interface Props {
  headers: string[];
  mapping: SpectrumMapping;
  onChange: (next: SpectrumMapping) => void;
}

const shown = (molar: number, unit: GridConcentrationUnit) =>
  String(Number((molar / CONCENTRATION_UNITS[unit]).toPrecision(8)));

/**
 * One quencher concentration per spectrum: filled from the file where it names one, typed
 * where it does not. A spectrum with an empty field stays out of the series.
 */
export function SpectrumSamplesEditor({ headers, mapping, onChange }: Props) {
  const [unit, setUnit] = useState<GridConcentrationUnit>('mM');
  const [texts, setTexts] = useState<Record<number, string>>(() =>
    Object.fromEntries(mapping.samples.map((sample) => [sample.column, shown(sample.concentration, 'mM')])),
  );
  const columns = headers
    .map((header, column) => ({ header, column }))
    .filter(({ column }) => column !== mapping.wavelength);

  function publish(nextTexts: Record<number, string>, nextUnit: GridConcentrationUnit) {
    const samples = columns.flatMap(({ column }) => {
      const value = Number((nextTexts[column] ?? '').trim().replace(',', '.'));
      return (nextTexts[column] ?? '').trim() !== '' && Number.isFinite(value) && value >= 0
        ? [{ column, concentration: value * CONCENTRATION_UNITS[nextUnit] }]
        : [];
    });
    onChange({ ...mapping, samples });
  }
  const invalid = (text: string | undefined) =>
    text !== undefined && text.trim() !== '' && !(Number(text.replace(',', '.')) >= 0);

  return (
    <div className="w-full space-y-2">
      <div className="flex items-end gap-3">
        <ConcentrationUnitField
          label="Typed concentrations in"
          value={unit}
          onChange={(next) => {
            setUnit(next);
            publish(texts, next);
          }}
        />
        <p className="pb-2 text-caption text-ink-500">Leave a field empty to keep that spectrum out of the series.</p>
      </div>
      <table aria-label="Spectra and their concentrations" className="text-body">
        <thead>
          <tr className="text-left text-caption text-ink-500">
            <th className="pr-4">Spectrum</th>
            <th>[Q] ({unitLabel(unit)})</th>
          </tr>
        </thead>
        <tbody>
          {columns.map(({ header, column }) => (
            <tr key={column}>
              <td className="pr-4">{header}</td>
              <td>
                <input
                  aria-label={`Concentration of ${header}`}
                  value={texts[column] ?? ''}
                  inputMode="decimal"
                  aria-invalid={invalid(texts[column]) || undefined}
                  className={`w-28 rounded border px-1.5 py-1 ${invalid(texts[column]) ? 'border-brick-500' : 'border-paper-300'}`}
                  onChange={(event) => {
                    const next = { ...texts, [column]: event.target.value };
                    setTexts(next);
                    publish(next, unit);
                  }}
                />
                {invalid(texts[column]) && (
                  <span className="ml-2 text-caption text-brick-700">a number of zero or more</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
