import { EngineError } from '../core/engine-error';
import { requireFiniteArray, requireNonNegativeArray, requirePositive } from '../core/validate';
import { blankSpectra, requireSpectrumPerConcentration } from './spectral-bands';

/** The quencher's own absorbance: ε(λ) in M^-1 cm^-1, or a spectrum of the quencher alone at a stated [Q] in the same cell. */
export type QuencherAbsorbance =
  | { kind: 'absorptivity'; values: readonly number[] }
  | { kind: 'spectrum'; concentration: number; values: readonly number[] };

export interface AbsorptionDifferenceInput {
  /** nm, strictly increasing */
  wavelengths: readonly number[];
  /** [Q] in mol/L, one per spectrum, at least one 0 */
  concentrations: readonly number[];
  /** absorbance, one spectrum per concentration on the one grid */
  spectra: readonly (readonly number[])[];
  /** cm, > 0 */
  pathLength: number;
  quencher?: QuencherAbsorbance;
}

export interface AbsorptionDifferences {
  /** the mean of the spectra at [Q] = 0 */
  blank: number[];
  /** each spectrum less the quencher's own absorbance [Q] ε_Q l */
  corrected: number[][];
  /** corrected − blank: what neither part explains */
  differences: number[][];
}

function requireOnGrid(values: readonly number[], wavelengths: readonly number[], field: string): void {
  if (values.length !== wavelengths.length)
    throw new EngineError(
      'LENGTH_MISMATCH',
      field,
      `has ${values.length} readings but the titration has ${wavelengths.length} wavelengths, so the spectra are on different wavelength grids`,
      'Put every spectrum on one wavelength grid',
    );
  requireFiniteArray(values, field);
}

/**
 * Difference spectra of a UV-vis titration with the quencher's own absorbance taken out. By
 * Beer–Lambert additivity of independent absorbers (common practice), if emitter and quencher do not interact each spectrum is A(λ) = A_E(λ) + ε_Q(λ) l [Q]; so
 * ΔA(λ, [Q]) = A(λ, [Q]) − ε_Q(λ) l [Q] − A(λ, 0) is zero but for noise, and a ground-state
 * complex shows as a change with its own band shape. ε_Q l comes from ε_Q and the path length,
 * or from a quencher-only spectrum at [Q]_ref as A_ref/[Q]_ref (same cell, so l cancels).
 * The emitter's concentration is taken as constant over the titration (no dilution correction).
 *
 * @throws EngineError LENGTH_MISMATCH (a spectrum or the quencher's on another grid), MISSING_I0 (no [Q] = 0), NON_POSITIVE_VALUE, NEGATIVE_VALUE, NON_FINITE_VALUE
 * @example absorptionDifferences({ wavelengths: [400, 410], concentrations: [0, 0.01], spectra: [[0.5, 0.4], [0.6, 0.45]], pathLength: 1, quencher: { kind: 'absorptivity', values: [10, 5] } }).differences[1] // [0, 0]
 */
export function absorptionDifferences(input: AbsorptionDifferenceInput): AbsorptionDifferences {
  const { wavelengths, concentrations, spectra, pathLength, quencher } = input;
  requirePositive(pathLength, 'pathLength', 'Give the cell length in cm (usually 1)');
  requireNonNegativeArray(concentrations, 'concentrations');
  requireSpectrumPerConcentration(spectra, concentrations);
  spectra.forEach((spectrum, j) => requireOnGrid(spectrum, wavelengths, `spectra[${j}]`));
  let perMolar: number[] | null = null;
  if (quencher) {
    requireOnGrid(quencher.values, wavelengths, 'quencher');
    if (quencher.kind === 'spectrum') {
      requirePositive(
        quencher.concentration,
        'quencher.concentration',
        'Give the quencher concentration of its own spectrum',
      );
      perMolar = quencher.values.map((value) => value / quencher.concentration);
    } else perMolar = quencher.values.map((epsilon) => epsilon * pathLength);
  }
  const blanks = blankSpectra(concentrations);
  const corrected = spectra.map((spectrum, j) =>
    perMolar ? spectrum.map((value, i) => value - concentrations[j]! * perMolar[i]!) : [...spectrum],
  );
  const blank = wavelengths.map((_, i) => blanks.reduce((sum, j) => sum + corrected[j]![i]!, 0) / blanks.length);
  const differences = corrected.map((spectrum) => spectrum.map((value, i) => value - blank[i]!));
  return { blank, corrected, differences };
}
