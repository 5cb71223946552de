import { EngineError } from '../core/engine-error';
import { requireFinite, requirePositive } from '../core/validate';
import { chiSquareUpperTail } from '../stats/chi-square-upper-tail';

export interface KsvHomogeneity {
  /** M^-1, Σ w K / Σ w with w = 1/SE² */
  weightedMean: number;
  /** M^-1, 1/√Σw */
  weightedMeanStandardError: number;
  /** Σ (K_i − K̄)² / SE_i² */
  chiSquare: number;
  degreesOfFreedom: number;
  /** P(χ² ≥ observed) with k − 1 degrees of freedom */
  pValue: number;
}

/**
 * χ² test that several estimates of one quantity (here K_SV in each band of the emission)
 * agree within their standard errors: χ² = Σ (K_i − K̄)² / SE_i² about the inverse-variance
 * weighted mean, k − 1 degrees of freedom (Bevington & Robinson, Data Reduction and Error
 * Analysis, 3rd ed., sect. 4.1 and 11.1). A small p-value says K_SV changes across the
 * emission, which one emitter quenched one way cannot do (Lakowicz, Principles of
 * Fluorescence Spectroscopy, 3rd ed., ch. 8).
 *
 * @param estimates - at least 2, each with value and standard error > 0
 * @throws EngineError TOO_FEW_POINTS, NON_POSITIVE_VALUE (an SE), NON_FINITE_VALUE
 * @example testKsvHomogeneity([{ value: 10, standardError: 1 }, { value: 12, standardError: 1 }]).chiSquare // 2
 */
export function testKsvHomogeneity(estimates: readonly { value: number; standardError: number }[]): KsvHomogeneity {
  if (estimates.length < 2)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'estimates',
      `a homogeneity test needs at least 2 estimates, got ${estimates.length}`,
      'Choose a narrower band width so the emission is cut into several bands',
    );
  let sumWeights = 0;
  let sumWeighted = 0;
  estimates.forEach((estimate, i) => {
    requireFinite(estimate.value, `estimates[${i}].value`);
    requirePositive(estimate.standardError, `estimates[${i}].standardError`);
    const weight = 1 / estimate.standardError ** 2;
    sumWeights += weight;
    sumWeighted += weight * estimate.value;
  });
  const weightedMean = sumWeighted / sumWeights;
  const chiSquare = estimates.reduce(
    (sum, estimate) => sum + ((estimate.value - weightedMean) / estimate.standardError) ** 2,
    0,
  );
  const degreesOfFreedom = estimates.length - 1;
  return {
    weightedMean,
    weightedMeanStandardError: 1 / Math.sqrt(sumWeights),
    chiSquare,
    degreesOfFreedom,
    pValue: chiSquareUpperTail(chiSquare, degreesOfFreedom),
  };
}
