import { EngineError } from '../core/engine-error';
import { requirePositive } from '../core/validate';
import { secondDifferenceNoise } from '../stats/second-difference-noise';
import { singularValues } from '../stats/singular-values';

export interface SpectralComponents {
  /** of the matrix whose columns are the spectra each scaled to unit Euclidean norm, largest first */
  singularValues: number[];
  /** one per spectrum: the noise SD of one reading, in the spectrum's own unit */
  noiseLevels: number[];
  /** singular values above this stand out from the noise */
  noiseThreshold: number;
  /** how many singular values exceed the threshold: the number of spectrally distinct emitters seen */
  significant: number;
}

/** Numerical rank floor relative to the largest singular value (Golub & Van Loan, 4th ed., sect. 5.4.1). */
const RANK_TOLERANCE = 1e-9;

/**
 * How many spectrally distinct emitters a set of emission spectra holds: the singular values
 * of the spectrum matrix with each spectrum scaled to unit norm (so quenching that only lowers
 * one emitter's intensity leaves one component; Golub & Van Loan, Matrix Computations, 4th ed.,
 * sect. 2.4 and 8.6 for the SVD and numerical rank). A singular value counts when it exceeds
 * the largest a matrix of pure noise would show, about σ (√m + √n) for an m × n matrix of
 * independent errors of SD σ (Davidson & Szarek, Handbook of the Geometry of Banach Spaces,
 * 2001, Thm II.13; quoted from memory), with σ the largest scaled noise of any spectrum,
 * estimated robustly from second differences unless given. Malinowski's factor-analysis
 * indicator function is not used.
 *
 * @param spectra - one array per sample (≥ 2), each with the same number (≥ 3) of readings
 * @param noiseLevel - optional noise SD of one reading, in the spectra's unit, for every spectrum
 * @throws EngineError TOO_FEW_POINTS, LENGTH_MISMATCH, DEGENERATE_DATA (a spectrum of zeros), NON_POSITIVE_VALUE
 * @example spectralComponents([[1, 2, 1], [2, 4, 2]]).significant // 1
 */
export function spectralComponents(spectra: readonly (readonly number[])[], noiseLevel?: number): SpectralComponents {
  if (spectra.length < 2)
    throw new EngineError('TOO_FEW_POINTS', 'spectra', `components need at least 2 spectra, got ${spectra.length}`);
  const readings = spectra[0]!.length;
  if (readings < 3)
    throw new EngineError('TOO_FEW_POINTS', 'spectra[0]', `a spectrum needs at least 3 readings, got ${readings}`);
  if (noiseLevel !== undefined) requirePositive(noiseLevel, 'noiseLevel');
  const noiseLevels = spectra.map((spectrum) => noiseLevel ?? secondDifferenceNoise(spectrum));
  const norms = spectra.map((spectrum, j) => {
    const norm = Math.sqrt(spectrum.reduce((sum, value) => sum + value * value, 0));
    if (!(norm > 0))
      throw new EngineError(
        'DEGENERATE_DATA',
        `spectra[${j}]`,
        'the spectrum is zero everywhere',
        'Remove it or upload the reading',
      );
    return norm;
  });
  const values = singularValues(spectra.map((spectrum, j) => spectrum.map((value) => value / norms[j]!)));
  const scaledNoise = Math.max(...noiseLevels.map((sigma, j) => sigma / norms[j]!));
  const noiseThreshold = Math.max(
    scaledNoise * (Math.sqrt(readings) + Math.sqrt(spectra.length)),
    RANK_TOLERANCE * values[0]!,
  );
  return {
    singularValues: values,
    noiseLevels,
    noiseThreshold,
    significant: values.filter((value) => value > noiseThreshold).length,
  };
}
