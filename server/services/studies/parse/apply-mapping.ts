import { pointAt, type StudyPointValues } from '@shared/schemas/study-points';
import type { SeriesMapping, SpectrumMapping, UploadMapping } from '@shared/schemas/study-uploads';
import { CONCENTRATION_FACTORS, TIME_FACTORS, VOLUME_FACTORS } from './header-units';
import { parseCellNumber } from './parse-number';
import { cellProblem, ParseProblem } from './parse-problem';
import { columnNumbers } from './column-numbers';
import type { RawTable } from './read-text-table';
import { integrateWindow, valueAt } from './reduce-spectrum';

const MAX_PROBLEMS = 20;

function columnName(table: RawTable, index: number) {
  return `${index + 1} ("${table.headers[index] ?? ''}")`;
}

function requireColumn(table: RawTable, index: number | null, what: string) {
  if (index !== null && (index < 0 || index >= table.headers.length)) {
    throw new ParseProblem(
      `The mapping puts ${what} in column ${index + 1}, but the table has ${table.headers.length} columns.`,
    );
  }
}

function seriesPoints(table: RawTable, mapping: SeriesMapping, problems: ParseProblem[]): StudyPointValues[] {
  const roles: Array<[keyof SeriesMapping & string, number | null, string]> = [
    ['concentration', mapping.concentration, 'a concentration of zero or more'],
    ['intensity', mapping.intensity, mapping.intensityIsRatio ? 'an I0/I ratio' : 'an intensity'],
    ['lifetime', mapping.lifetime, 'a lifetime above zero'],
    ['absorbanceExcitation', mapping.absorbanceExcitation, 'an absorbance'],
    ['absorbanceEmission', mapping.absorbanceEmission, 'an absorbance'],
    ['volumeAdded', mapping.volumeAdded, 'a volume of zero or more'],
    ['uncertainty', mapping.uncertainty, 'an uncertainty above zero'],
  ];
  for (const [name, index] of roles) requireColumn(table, index, name);
  requireColumn(table, mapping.run, 'the run');
  for (const index of mapping.moreIntensities) requireColumn(table, index, 'a further run');
  if (mapping.run !== null && mapping.moreIntensities.length > 0)
    throw new ParseProblem('Map either a run column or one intensity column per run, not both.');
  if (mapping.moreIntensities.length > 0 && mapping.intensity === null)
    throw new ParseProblem('Map the intensity column of run 1 before the columns of further runs.');
  const runOf = runNumbers(table, mapping.run, problems);
  if (mapping.intensity === null && mapping.lifetime === null)
    throw new ParseProblem('Map an intensity (or I0/I) column or a lifetime column.');
  if (mapping.concentrationUnit === null)
    throw new ParseProblem(
      `Choose the unit of the concentration column ${columnName(table, mapping.concentration)}: its header names none, and Halflight does not guess one.`,
      null,
      columnName(table, mapping.concentration),
    );
  const scale: Record<string, number> = {
    concentration: CONCENTRATION_FACTORS[mapping.concentrationUnit],
    lifetime: TIME_FACTORS[mapping.lifetimeUnit],
    volumeAdded: VOLUME_FACTORS[mapping.volumeUnit],
  };
  return table.rows.flatMap((row, rowIndex) => {
    const values: Record<string, number | null> = {};
    for (const [name, index, expected] of roles) {
      if (index === null) {
        values[name] = null;
        continue;
      }
      const text = row.cells[index] ?? '';
      const value = parseCellNumber(text, table.decimalComma);
      const bad =
        value === undefined ||
        (value === null && name === 'concentration') ||
        (value !== null &&
          value !== undefined &&
          (((name === 'concentration' || name === 'volumeAdded') && value < 0) ||
            ((name === 'lifetime' || name === 'uncertainty') && value <= 0)));
      if (bad) {
        if (problems.length < MAX_PROBLEMS)
          problems.push(cellProblem(row.line, columnName(table, index), expected, text));
        values[name] = null;
        continue;
      }
      values[name] = value === null || value === undefined ? null : value * (scale[name] ?? 1);
    }
    const point: StudyPointValues = {
      concentration: values.concentration ?? 0,
      intensity: values.intensity ?? null,
      lifetime: values.lifetime ?? null,
      absorbanceExcitation: values.absorbanceExcitation ?? null,
      absorbanceEmission: values.absorbanceEmission ?? null,
      volumeAdded: values.volumeAdded ?? null,
      uncertainty: values.uncertainty ?? null,
      excluded: false,
      exclusionReason: null,
      series: runOf(rowIndex),
    };
    // One intensity column per further run: the same sample, another reading (lifetime and σ stay with run 1).
    const further = mapping.moreIntensities.map((index, k) => {
      const text = row.cells[index] ?? '';
      const value = parseCellNumber(text, table.decimalComma);
      if (value === undefined && problems.length < MAX_PROBLEMS)
        problems.push(
          cellProblem(
            row.line,
            columnName(table, index),
            mapping.intensityIsRatio ? 'an I0/I ratio' : 'an intensity',
            text,
          ),
        );
      return {
        ...point,
        intensity: value ?? null,
        lifetime: null,
        uncertainty: null,
        series: k + 2,
      };
    });
    return [point, ...further.filter((reading) => reading.intensity !== null)];
  });
}

/**
 * Each row's run: 1 without a run column; with one, whole numbers ≥ 1 as written, and otherwise the
 * labels numbered 1, 2, … in the order they first appear ("A", "B" or "day 1", "day 2").
 */
function runNumbers(table: RawTable, index: number | null, problems: ParseProblem[]): (row: number) => number {
  if (index === null) return () => 1;
  const labels = table.rows.map((row) => (row.cells[index] ?? '').trim());
  table.rows.forEach((row, i) => {
    if (labels[i] === '' && problems.length < MAX_PROBLEMS)
      problems.push(cellProblem(row.line, columnName(table, index), 'a run (a number or a name)', ''));
  });
  if (labels.every((label) => label === '' || /^[1-9]\d{0,5}$/.test(label)))
    return (row) => (labels[row] === '' ? 1 : Number(labels[row]));
  const order = new Map<string, number>();
  for (const label of labels) if (label !== '' && !order.has(label)) order.set(label, order.size + 1);
  return (row) => order.get(labels[row]!) ?? 1;
}

function spectrumPoints(table: RawTable, mapping: SpectrumMapping, problems: ParseProblem[]): StudyPointValues[] {
  requireColumn(table, mapping.wavelength, 'the wavelength');
  for (const sample of mapping.samples) requireColumn(table, sample.column, 'a sample');
  // Cells are read through columnNumbers (once per table) and walked with loops: a spectrum matrix holds a million cells.
  const column = (index: number, expected: string) => {
    const values = columnNumbers(table, index);
    return (i: number) => {
      const value = values[i];
      if (value === null || value === undefined) {
        if (problems.length < MAX_PROBLEMS)
          problems.push(
            cellProblem(table.rows[i]!.line, columnName(table, index), expected, table.rows[i]!.cells[index] ?? ''),
          );
        return Number.NaN;
      }
      return value;
    };
  };
  // A file whose spectra name no concentration is still readable: the preview asks for them (mappingNotes).
  if (mapping.samples.length === 0) return [];
  const wavelengthOf = column(mapping.wavelength, 'a wavelength in nm');
  const wavelengths = table.rows.map((_, i) => wavelengthOf(i));
  const spectra = mapping.samples.map((sample) => {
    const intensityOf = column(sample.column, 'an intensity');
    const x: number[] = [];
    const y: number[] = [];
    table.rows.forEach((row, i) => {
      // Spectra on different grids (JCAMP-DX blocks) leave blanks where a spectrum was not measured.
      if (table.blankIsUnmeasured && (row.cells[sample.column] ?? '').trim() === '') return;
      x.push(wavelengths[i]!);
      y.push(intensityOf(i));
    });
    return { x, y };
  });
  if (problems.length > 0) return [];
  const { reduction, baseline } = mapping;
  return mapping.samples.map((sample, i) => {
    const { x, y } = spectra[i]!;
    // The mean over the baseline region is the offset under the whole spectrum (stray light, dark counts).
    const offset = baseline ? integrateWindow(x, y, baseline.start, baseline.end) / (baseline.end - baseline.start) : 0;
    const intensity =
      reduction.kind === 'window'
        ? integrateWindow(x, y, reduction.start, reduction.end) - offset * (reduction.end - reduction.start)
        : valueAt(x, y, reduction.at) - offset;
    return spectrumPoint(sample.concentration, intensity);
  });
}

const spectrumPoint = (concentration: number, intensity: number): StudyPointValues => ({
  ...pointAt(concentration),
  intensity,
});

/** Table + mapping -> series points in SI units; every bad cell is reported by row and column. */
export function applyMapping(
  table: RawTable,
  mapping: UploadMapping,
): { points: StudyPointValues[]; problems: ParseProblem[] } {
  const problems: ParseProblem[] = [];
  const points =
    mapping.layout === 'series' ? seriesPoints(table, mapping, problems) : spectrumPoints(table, mapping, problems);
  return { points: problems.length > 0 ? [] : points, problems };
}
