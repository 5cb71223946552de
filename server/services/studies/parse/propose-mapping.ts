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

/**
 * A first guess at the mapping from the headers: a spectrum matrix when the first column is a
 * wavelength and the others name concentrations; otherwise a series by column names (or by
 * position: concentration, intensity, lifetime, uncertainty).
 */
export function proposeMapping(table: RawTable): UploadMapping {
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
    const { low, high } = sharedRange(
      table,
      sampleColumns.map((sample) => sample.column),
    );
    return { layout: 'spectrum', wavelength: 0, samples, reduction: { kind: 'window', start: low, end: high } };
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
  const free = headers.map((_, i) => i).filter((i) => !taken.has(i));
  const byPosition = intensity ?? free.shift() ?? null;
  const concentrationHeader = headers[concentration]!;
  return {
    layout: 'series',
    concentration,
    concentrationUnit: concentrationUnitOf(concentrationHeader) ?? 'M',
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
  };
}
