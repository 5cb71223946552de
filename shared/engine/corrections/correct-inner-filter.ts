import { requireNonNegative, requireFinite } from '../core/validate';
import { qualityFlag, type QualityFlag } from '../flags/quality-flag';

export interface InnerFilterCorrection {
  correctedIntensity: number;
  /** 10^((A_ex + A_em)/2) */
  factor: number;
  flags: QualityFlag[];
}

/** A correction above this relative size (5 %) is flagged. */
export const INNER_FILTER_FLAG_THRESHOLD = 0.05;

/**
 * Inner-filter correction for a right-angle, 1 cm cell: F_corr = F_obs 10^((A_ex +
 * A_em)/2) (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., ch. 2), from
 * absorbances measured at the excitation and emission wavelengths. The form is an
 * approximation for moderate absorbance; a correction beyond `flagThreshold` is flagged.
 *
 * @param input.intensity - observed intensity (finite)
 * @param input.absorbanceExcitation - A at lambda_ex (>= 0), 1 cm
 * @param input.absorbanceEmission - A at lambda_em (>= 0), 1 cm
 * @param input.flagThreshold - relative correction that raises INNER_FILTER_LARGE, default 0.05
 * @throws EngineError NON_FINITE_VALUE, NEGATIVE_VALUE
 * @example correctInnerFilter({ intensity: 100, absorbanceExcitation: 0.1, absorbanceEmission: 0.05 }).factor // 1.1885
 */
export function correctInnerFilter(input: {
  intensity: number;
  absorbanceExcitation: number;
  absorbanceEmission: number;
  flagThreshold?: number;
}): InnerFilterCorrection {
  const intensity = requireFinite(input.intensity, 'intensity');
  const advice = 'Absorbances below zero usually come from the baseline; re-zero the spectrometer';
  const aEx = requireNonNegative(input.absorbanceExcitation, 'absorbanceExcitation', advice);
  const aEm = requireNonNegative(input.absorbanceEmission, 'absorbanceEmission', advice);
  const threshold = requireNonNegative(input.flagThreshold ?? INNER_FILTER_FLAG_THRESHOLD, 'flagThreshold');
  const factor = 10 ** ((aEx + aEm) / 2);
  const flags =
    factor - 1 > threshold
      ? [qualityFlag('INNER_FILTER_LARGE', `correction factor ${factor.toFixed(3)} (A_ex ${aEx}, A_em ${aEm})`)]
      : [];
  return { correctedIntensity: intensity * factor, factor, flags };
}
