import { SelectField } from '@/components/select-field';
import { unitLabel } from '@shared/units/units';
import { gridConcentrationUnits, type GridConcentrationUnit } from './format';

const options = gridConcentrationUnits.map((value) => ({ value, label: unitLabel(value) }));

/** Which unit typed concentrations are in (M, mM, µM); the values are kept in mol/L whatever is chosen. */
export function ConcentrationUnitField({
  label,
  value,
  onChange,
}: {
  label: string;
  value: GridConcentrationUnit;
  onChange: (unit: GridConcentrationUnit) => void;
}) {
  return (
    <SelectField
      label={label}
      value={value}
      options={options}
      onChange={(event) => onChange(event.target.value as GridConcentrationUnit)}
    />
  );
}
