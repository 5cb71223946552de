import { ChoiceField } from '@/components/choice-field';
import { unitLabel } from '@shared/units/units';
import { gridConcentrationUnits, type GridConcentrationUnit } from './format';

const choices = gridConcentrationUnits.map((value) => ({ value, label: unitLabel(value) }));

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
  return <ChoiceField label={label} value={value} choices={choices} onChange={onChange} />;
}
