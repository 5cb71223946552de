import type { UploadMapping } from '@shared/schemas/study-uploads';
import { concentrationInHeader, concentrationUnitOf, timeUnitOf, volumeUnitOf } from './header-units';
import type { RawTable } from './read-text-table';

const find = (headers: string[], pattern: RegExp, taken: Set<number>) => {
  const index = headers.findIndex((header, i) => !taken.has(i) && pattern.test(header));
  if (index >= 0) taken.add(index);
  return index >= 0 ? index : null;
};

/** The wavelength range every sample column covers (spectra on different grids overlap only partly). */
function sharedRange(table: RawTable, columns: number[]) {
  // Each row's wavelength is read once (a spectrum matrix has thousands of rows and hundreds of columns).
  const wavelengths: number[] = [];
  const wavelengthAt = (i: number) => (wavelengths[i] ??= Number(table.rows[i]!.cells[0]!.replace(',', '.')));
  const ranges = columns.flatMap((column) => {
    let low = Infinity;
    let high = -Infinity;
    table.rows.forEach((row, i) => {
      if ((row.cells[column] ?? '').trim() === '') return;
      const wavelength = wavelengthAt(i);
      if (!Number.isFinite(wavelength)) return;
      low = Math.min(low, wavelength);
      high = Math.max(high, wavelength);
    });
    return low <= high ? [[low, high] as const] : [];
  });
  const low = Math.max(...ranges.map(([start]) => start));
  const high = Math.min(...ranges.map(([, end]) => end));
  return high > low ? { low, high } : { low: ranges[0]![0], high: ranges[0]![1] };
}

/** What the user still has to do for a proposed mapping: spectra whose concentration the file does not give. */
export function mappingNotes(table: RawTable, mapping: UploadMapping): string[] {
  if (mapping.layout !== 'spectrum') return [];
  const used = new Set(mapping.samples.map((sample) => sample.column));
  return table.headers.flatMap((header, column) =>
    column === mapping.wavelength || used.has(column)
      ? []
      : [
          `Spectrum "${header}" names no quencher concentration (in its title, ##CONCENTRATIONS= or sample description); type it to use this spectrum.`,
        ],
  );
}

/** What the study says about reading its emission, used as the spectrum reduction's default. */
export interface StudyReading {
  windowStart: number | null;
  windowEnd: number | null;
  emissionWavelength: number | null;
}
export const NO_STUDY_READING: StudyReading = { windowStart: null, windowEnd: null, emissionWavelength: null };

/**
 * The study's emission window (or wavelength) when the spectra cover it, else the range all
 * spectra share; a note says when the study's choice could not be used.
 */
function defaultReduction(range: { low: number; high: number }, study: StudyReading) {
  const covered = (nm: number) => nm >= range.low && nm <= range.high;
  const { windowStart: start, windowEnd: end, emissionWavelength: at } = study;
  if (start !== null && end !== null && end > start) {
    if (covered(start) && covered(end)) return { reduction: { kind: 'window' as const, start, end }, note: null };
    return {
      reduction: { kind: 'window' as const, start: range.low, end: range.high },
      note: `The study's emission window ${start}–${end} nm reaches outside the spectra (${range.low}–${range.high} nm); the whole shared range is proposed instead.`,
    };
  }
  if (at !== null) {
    if (covered(at)) return { reduction: { kind: 'wavelength' as const, at }, note: null };
    return {
      reduction: { kind: 'window' as const, start: range.low, end: range.high },
      note: `The study's emission wavelength ${at} nm lies outside the spectra (${range.low}–${range.high} nm); the whole shared range is proposed instead.`,
    };
  }
  return { reduction: { kind: 'window' as const, start: range.low, end: range.high }, note: null };
}

/**
 * A first guess at the mapping from the headers: a spectrum matrix when the first column is a
 * wavelength and the others name concentrations (reduced over the study's emission window or
 * at its emission wavelength when it has one); otherwise a series by column names (or by
 * position: concentration, intensity, lifetime, uncertainty). A concentration header without
 * a unit leaves the unit open (null): the preview asks for it.
 */
export function proposeMapping(table: RawTable, study: StudyReading = NO_STUDY_READING): UploadMapping {
  return proposeWithNotes(table, study).mapping;
}

export function proposeWithNotes(table: RawTable, study: StudyReading): { mapping: UploadMapping; notes: string[] } {
  const { headers } = table;
  const sampleColumns = headers
    .slice(1)
    .map((header, i) => ({ column: i + 1, concentration: concentrationInHeader(header) }));
  const named = sampleColumns.every((sample) => sample.concentration !== null);
  if (
    table.layoutHint === 'spectrum' ||
    (/wave|lambda|λ|\bnm\b/i.test(headers[0]!) && sampleColumns.length >= 2 && named)
  ) {
    // Spectra without a concentration stay out until the user types one (mappingNotes says which).
    const samples = sampleColumns.flatMap((sample) =>
      sample.concentration === null ? [] : [{ column: sample.column, concentration: sample.concentration }],
    );
    const range = sharedRange(
      table,
      sampleColumns.map((sample) => sample.column),
    );
    const { reduction, note } = defaultReduction(range, study);
    return {
      mapping: { layout: 'spectrum', wavelength: 0, samples, reduction, baseline: null },
      notes: note ? [note] : [],
    };
  }
  const taken = new Set<number>();
  const concentration = find(headers, /conc|\[q\]|quench|^c\b|^q\b/i, taken) ?? (taken.add(0), 0);
  const ratio = find(headers, /i0\s*\/\s*i|ratio/i, taken);
  const intensity = ratio ?? find(headers, /intens|counts|signal|emission|^i\b|area|integral/i, taken);
  const lifetime = find(headers, /lifetime|tau|τ/i, taken);
  const absorbanceExcitation = find(headers, /a.?ex|abs.*ex/i, taken);
  const absorbanceEmission = find(headers, /a.?em|abs.*em/i, taken);
  const volumeAdded = find(headers, /vol|added/i, taken);
  const uncertainty = find(headers, /sd|sigma|σ|err|uncert/i, taken);
  const run = find(headers, /^(run|series|replicate|repeat)\b/i, taken);
  const free = headers.map((_, i) => i).filter((i) => !taken.has(i));
  const byPosition = intensity ?? free.shift() ?? null;
  const concentrationHeader = headers[concentration]!;
  const mapping: UploadMapping = {
    layout: 'series',
    concentration,
    concentrationUnit: concentrationUnitOf(concentrationHeader),
    intensity: byPosition,
    intensityIsRatio: ratio !== null,
    lifetime:
      lifetime ?? (headers.length >= 3 && byPosition !== null && intensity === null ? (free.shift() ?? null) : null),
    lifetimeUnit: lifetime !== null ? (timeUnitOf(headers[lifetime]!) ?? 's') : 's',
    absorbanceExcitation,
    absorbanceEmission,
    volumeAdded,
    volumeUnit: volumeAdded !== null ? (volumeUnitOf(headers[volumeAdded]!) ?? 'L') : 'L',
    uncertainty,
    run,
    moreIntensities: [],
  };
  return { mapping, notes: [] };
}
