import type { UploadMapping } from '@shared/schemas/study-uploads';
import { concentrationInHeader, concentrationUnitOf, timeUnitOf, volumeUnitOf } from './header-units';
import type { RawTable } from './read-text-table';

const find = (headers: string[], pattern: RegExp, taken: Set<number>) => {
  const index = headers.findIndex((header, i) => !taken.has(i) && pattern.test(header));
  if (index >= 0) taken.add(index);
  return index >= 0 ? index : null;
};

/**
 * A first guess at the mapping from the headers: a spectrum matrix when the first column is a
 * wavelength and the others name concentrations; otherwise a series by column names (or by
 * position: concentration, intensity, lifetime, uncertainty).
 */
export function proposeMapping(table: RawTable): UploadMapping {
  const { headers } = table;
  const sampleColumns = headers.slice(1).map((header, i) => ({ column: i + 1, concentration: concentrationInHeader(header) }));
  if (/wave|lambda|λ|\bnm\b/i.test(headers[0]!) && sampleColumns.length >= 2 && sampleColumns.every((sample) => sample.concentration !== null)) {
    const wavelengths = table.rows.map((row) => Number(row.cells[0]!.replace(',', '.'))).filter(Number.isFinite);
    const low = Math.min(...wavelengths);
    const high = Math.max(...wavelengths);
    return {
      layout: 'spectrum',
      wavelength: 0,
      samples: sampleColumns.map((sample) => ({ column: sample.column, concentration: sample.concentration! })),
      reduction: { kind: 'window', start: low, end: high },
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
  const free = headers.map((_, i) => i).filter((i) => !taken.has(i));
  const byPosition = intensity ?? free.shift() ?? null;
  const concentrationHeader = headers[concentration]!;
  return {
    layout: 'series',
    concentration,
    concentrationUnit: concentrationUnitOf(concentrationHeader) ?? 'M',
    intensity: byPosition,
    intensityIsRatio: ratio !== null,
    lifetime: lifetime ?? (headers.length >= 3 && byPosition !== null && intensity === null ? (free.shift() ?? null) : null),
    lifetimeUnit: lifetime !== null ? (timeUnitOf(headers[lifetime]!) ?? 's') : 's',
    absorbanceExcitation,
    absorbanceEmission,
    volumeAdded,
    volumeUnit: volumeAdded !== null ? (volumeUnitOf(headers[volumeAdded]!) ?? 'L') : 'L',
    uncertainty,
  };
}
