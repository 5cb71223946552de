import { EngineError } from '../core/engine-error';
import { requireFiniteArray, requireNonNegative } from '../core/validate';

/** One band of a spectrum matrix: its edges and the summed reading of each spectrum in it. */
export interface SpectralBand {
  /** nm, the first and last wavelength read inside the band */
  start: number;
  end: number;
  /** nm, the mean of the wavelengths inside the band */
  centre: number;
  /** one per spectrum: the sum of its readings inside the band */
  intensities: number[];
}

/**
 * Cuts a spectrum matrix into bands of equal width starting at the first wavelength and sums
 * each spectrum's readings inside each band (on an even grid the sum is the band integral up
 * to the constant step; common practice). A width of 0, or one below the grid step, gives one
 * band per wavelength.
 *
 * @param wavelengths - nm, strictly increasing, at least 2
 * @param spectra - one array per sample, each with one reading per wavelength
 * @param bandWidth - nm, ≥ 0
 * @throws EngineError INVALID_ARGUMENT (wavelengths not increasing), LENGTH_MISMATCH, NON_FINITE_VALUE, NEGATIVE_VALUE
 * @example spectralBands([400, 401, 402, 403], [[1, 2, 3, 4]], 2).map((b) => b.intensities[0]) // [3, 7]
 */
export function spectralBands(
  wavelengths: readonly number[],
  spectra: readonly (readonly number[])[],
  bandWidth: number,
): SpectralBand[] {
  requireNonNegative(bandWidth, 'bandWidth');
  requireFiniteArray(wavelengths, 'wavelengths');
  if (wavelengths.length < 2)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'wavelengths',
      `a spectrum needs at least 2 wavelengths, got ${wavelengths.length}`,
    );
  // 1 <= i < length: i and i - 1 index elements.
  for (let i = 1; i < wavelengths.length; i++)
    if (!(wavelengths[i]! > wavelengths[i - 1]!))
      throw new EngineError(
        'INVALID_ARGUMENT',
        `wavelengths[${i}]`,
        `wavelengths must increase, but ${wavelengths[i]} follows ${wavelengths[i - 1]}`,
        'Give each spectrum on one increasing wavelength grid',
      );
  spectra.forEach((spectrum, j) => {
    if (spectrum.length !== wavelengths.length)
      throw new EngineError(
        'LENGTH_MISMATCH',
        `spectra[${j}]`,
        `has ${spectrum.length} readings but there are ${wavelengths.length} wavelengths`,
        'Put every spectrum on the same wavelength grid',
      );
    requireFiniteArray(spectrum, `spectra[${j}]`);
  });
  const first = wavelengths[0]!;
  const bands: SpectralBand[] = [];
  let current: { index: number; members: number[] } | null = null;
  const close = () => {
    if (!current) return;
    const members = current.members;
    const at = members.map((i) => wavelengths[i]!);
    bands.push({
      start: at[0]!,
      end: at.at(-1)!,
      centre: at.reduce((sum, value) => sum + value, 0) / at.length,
      intensities: spectra.map((spectrum) => members.reduce((sum, i) => sum + spectrum[i]!, 0)),
    });
  };
  wavelengths.forEach((wavelength, i) => {
    // A tiny allowance keeps a reading exactly on an edge (402.0000001 from float steps) in its band.
    const index = bandWidth > 0 ? Math.floor((wavelength - first) / bandWidth + 1e-9) : i;
    if (current && current.index === index) current.members.push(i);
    else {
      close();
      current = { index, members: [i] };
    }
  });
  close();
  return bands;
}

/** The positions of the spectra taken without quencher ([Q] = 0); refuses a series that has none. */
export function blankSpectra(concentrations: readonly number[]): number[] {
  const blanks = concentrations.flatMap((q, j) => (q === 0 ? [j] : []));
  if (blanks.length === 0)
    throw new EngineError(
      'MISSING_I0',
      'concentrations',
      'no spectrum at [Q] = 0',
      'Add the spectrum without quencher',
    );
  return blanks;
}

/** Refuses a series whose spectra and quencher concentrations are not one to one. */
export function requireSpectrumPerConcentration(
  spectra: readonly (readonly number[])[],
  concentrations: readonly number[],
): void {
  if (spectra.length !== concentrations.length)
    throw new EngineError(
      'LENGTH_MISMATCH',
      'spectra',
      `there are ${spectra.length} spectra but ${concentrations.length} concentrations`,
      'Give one quencher concentration per spectrum',
    );
}
