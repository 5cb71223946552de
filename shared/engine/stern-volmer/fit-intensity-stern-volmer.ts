import { requirePositiveArray, requireSameLength } from '../core/validate';
import type { InterceptMode } from './diagnose-curvature';
import { fitSternVolmer, type SternVolmerFit } from './fit-stern-volmer';
import { referenceFromBlanks, withReferenceUncertainty, type ReferenceValue } from './reference-from-blanks';

export interface IntensitySternVolmerFit extends SternVolmerFit {
  i0: ReferenceValue;
}

/**
 * Stern–Volmer fit of steady-state intensities: I0/I = 1 + K_SV [Q]. I0 is the given
 * value or the mean of the replicates at [Q] = 0 (Lakowicz, Principles of Fluorescence
 * Spectroscopy, 3rd ed., ch. 8). Per-point intensity uncertainties sigma_I become
 * ratio uncertainties sigma = (I0/I) sigma_I / I, i.e. weights 1/sigma^2 (the
 * uncertainty of I0 is common to all points and does not change the weights; it is
 * added to the standard errors of K_SV and the intercept when I0 comes from >= 2 blanks).
 *
 * @param input.concentrations - [Q] in mol/L (>= 0)
 * @param input.intensities - emission intensities in any consistent unit (> 0)
 * @param input.intensityUncertainties - optional 1-sigma of each intensity, same unit
 * @param input.i0 - optional unquenched intensity; wins over zero-concentration points
 * @param input.intercept - 'free' (default) or 'fixed-at-one'
 * @throws EngineError NON_POSITIVE_VALUE (zero or negative intensity), MISSING_I0, TOO_FEW_CONCENTRATIONS, and those of fitSternVolmer
 * @example fitIntensitySternVolmer({ concentrations: [0, 1e-3, 2e-3, 3e-3], intensities: [100, 50, 33.333333, 25] }).kSv.value // ~1000
 */
export function fitIntensitySternVolmer(input: {
  concentrations: readonly number[];
  intensities: readonly number[];
  intensityUncertainties?: readonly number[];
  i0?: number;
  intercept?: InterceptMode;
}): IntensitySternVolmerFit {
  const { concentrations, intensities, intensityUncertainties, intercept } = input;
  requireSameLength(concentrations, intensities, 'concentrations', 'intensities');
  requirePositiveArray(
    intensities,
    'intensities',
    'A ratio I0/I needs positive intensities; check background subtraction and the integration window',
  );
  const i0 = referenceFromBlanks(concentrations, intensities, input.i0, { field: 'i0', code: 'MISSING_I0' });
  const ratios = intensities.map((intensity) => i0.value / intensity);
  let ratioUncertainties: number[] | undefined;
  if (intensityUncertainties) {
    requireSameLength(intensities, intensityUncertainties, 'intensities', 'intensityUncertainties');
    // Same length as intensities (checked just above), and ratios is intensities mapped: index i exists.
    ratioUncertainties = intensityUncertainties.map((sigma, i) => (ratios[i]! * sigma) / intensities[i]!);
  }
  const fit = fitSternVolmer({
    concentrations,
    ratios,
    ...(ratioUncertainties ? { ratioUncertainties } : {}),
    ...(intercept ? { intercept } : {}),
  });
  return { ...withReferenceUncertainty(fit, i0, ratioUncertainties), i0 };
}
