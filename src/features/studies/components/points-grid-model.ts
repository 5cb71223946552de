import type { StudyPoint } from '@shared/schemas/study-points';
import type { StudyPointInput } from '@shared/schemas/study-points';
import { CONCENTRATION_UNITS, TIME_UNITS, VOLUME_UNITS, type ConcentrationUnit } from '@shared/units/units';

/** Grid columns in order; lifetimes are typed in ns and volumes in µL, converted at save; Run numbers replicate titrations (empty = 1). */
export const gridColumns = [
  { key: 'concentration', label: 'Concentration' },
  { key: 'intensity', label: 'Intensity' },
  { key: 'lifetime', label: 'Lifetime (ns)' },
  { key: 'absorbanceExcitation', label: 'A at λex' },
  { key: 'absorbanceEmission', label: 'A at λem' },
  { key: 'volumeAdded', label: 'Added (µL)' },
  { key: 'uncertainty', label: 'Uncertainty' },
  { key: 'series', label: 'Run' },
] as const;
export type GridKey = (typeof gridColumns)[number]['key'];
/** pointId: the saved point the row was loaded from (null for a typed or pasted row not yet saved). */
export type GridRow = Record<GridKey, string> & { excluded: boolean; exclusionReason: string; pointId: string | null };

const scale = (unit: ConcentrationUnit): Record<GridKey, number> => ({
  concentration: CONCENTRATION_UNITS[unit],
  intensity: 1,
  lifetime: TIME_UNITS.ns,
  absorbanceExcitation: 1,
  absorbanceEmission: 1,
  volumeAdded: VOLUME_UNITS.uL,
  uncertainty: 1,
  series: 1,
});

const show = (value: number | null, factor: number) =>
  value === null ? '' : String(Number((value / factor).toPrecision(10)));

export const emptyRow = (): GridRow => ({
  concentration: '',
  intensity: '',
  lifetime: '',
  absorbanceExcitation: '',
  absorbanceEmission: '',
  volumeAdded: '',
  uncertainty: '',
  series: '',
  excluded: false,
  exclusionReason: '',
  pointId: null,
});

export function rowsFromPoints(points: StudyPoint[], unit: ConcentrationUnit): GridRow[] {
  const factors = scale(unit);
  return points.map((point) => ({
    ...(Object.fromEntries(gridColumns.map(({ key }) => [key, show(point[key], factors[key])])) as Record<
      GridKey,
      string
    >),
    excluded: point.excluded,
    exclusionReason: point.exclusionReason ?? '',
    pointId: point.id,
  }));
}

/**
 * The saved point whose corrected values belong beside this row: the one it was loaded from,
 * and only while the row still holds that point's values (an edited row waits for the save).
 */
export function savedPointOf(
  row: GridRow,
  savedById: ReadonlyMap<string, StudyPoint>,
  unit: ConcentrationUnit,
): StudyPoint | null {
  const point = row.pointId === null ? undefined : savedById.get(row.pointId);
  if (!point || row.excluded !== point.excluded) return null;
  const factors = scale(unit);
  const same = gridColumns.every(({ key }) => {
    const text = row[key].trim().replace(',', '.');
    const saved = point[key];
    if (text === '' || saved === null) return text === '' && saved === null;
    const typed = Number(text) * factors[key];
    return Math.abs(typed - saved) <= 1e-9 * Math.max(Math.abs(saved), Math.abs(typed));
  });
  return same ? point : null;
}

/** Grid text -> API points in SI units; a cell that is not a number comes back as a problem naming row and column. */
export function pointsFromRows(
  rows: GridRow[],
  unit: ConcentrationUnit,
): { points: StudyPointInput[]; problems: string[] } {
  const factors = scale(unit);
  const problems: string[] = [];
  const points = rows
    .filter((row) => gridColumns.some(({ key }) => row[key].trim() !== ''))
    .map((row, index) => {
      const values = {} as Record<GridKey, number | null>;
      for (const { key, label } of gridColumns) {
        const text = row[key].trim().replace(',', '.');
        if (text === '') values[key] = null;
        else if (Number.isFinite(Number(text))) values[key] = Number(text) * factors[key];
        else {
          problems.push(`Row ${index + 1}, ${label}: "${row[key]}" is not a number.`);
          values[key] = null;
        }
      }
      if (values.concentration === null) problems.push(`Row ${index + 1}: the concentration is missing.`);
      return {
        ...values,
        concentration: values.concentration ?? 0,
        // an empty run cell is run 1 (one titration)
        series: values.series ?? 1,
        excluded: row.excluded,
        exclusionReason: row.excluded ? row.exclusionReason || null : null,
      };
    });
  return { points, problems };
}

/** Tab- and line-separated text from a spreadsheet, pasted from a starting cell. */
export function pasteInto(rows: GridRow[], text: string, startRow: number, startColumn: number): GridRow[] {
  const lines = text
    .replace(/\r/g, '')
    .split('\n')
    .filter((line, i, all) => line !== '' || i < all.length - 1);
  const next = rows.map((row) => ({ ...row }));
  lines.forEach((line, offset) => {
    const target = startRow + offset;
    while (next.length <= target) next.push(emptyRow());
    line.split('\t').forEach((cell, columnOffset) => {
      const column = gridColumns[startColumn + columnOffset];
      if (column) next[target]![column.key] = cell.trim();
    });
  });
  return next;
}
