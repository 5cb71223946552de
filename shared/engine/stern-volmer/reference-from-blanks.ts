import { EngineError, type EngineErrorCode } from '../core/engine-error';
import { requirePositive } from '../core/validate';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import type { SternVolmerFit } from './fit-stern-volmer';

export interface ReferenceValue {
  value: number;
  source: 'given' | 'mean-of-zero-concentration-points';
  /** number of points at [Q] = 0 that were averaged (0 when given) */
  replicates: number;
  /** standard error of the mean over value, from >= 2 replicates; null otherwise */
  relativeStandardError: number | null;
}

/**
 * The unquenched reference (I0 or tau0): the given value when there is one, otherwise
 * the mean of the replicate measurements at zero quencher concentration.
 *
 * @param concentrations - [Q] in mol/L
 * @param values - intensities or lifetimes, validated by the caller
 * @param given - optional explicit reference value (> 0)
 * @param names - field name and error code for messages ('i0'/'MISSING_I0' or 'tau0'/'MISSING_TAU0')
 * @throws EngineError MISSING_I0 / MISSING_TAU0 when there is no zero point and no value is given
 * @example referenceFromBlanks([0, 0, 1e-3], [100, 102, 50], undefined, { field: 'i0', code: 'MISSING_I0' }).value // 101 (relativeStandardError 0.0099)
 */
export function referenceFromBlanks(
  concentrations: readonly number[],
  values: readonly number[],
  given: number | undefined,
  names: { field: string; code: EngineErrorCode },
): ReferenceValue {
  if (given !== undefined) {
    return { value: requirePositive(given, names.field), source: 'given', replicates: 0, relativeStandardError: null };
  }
  let sum = 0;
  let replicates = 0;
  // The callers check that values has one entry per concentration, so values[i] exists.
  for (let i = 0; i < concentrations.length; i++) {
    if (concentrations[i] === 0) {
      sum += values[i]!;
      replicates++;
    }
  }
  if (replicates === 0) {
    throw new EngineError(
      names.code,
      names.field,
      'there is no point at zero quencher concentration and no value was given',
      `Measure a sample without quencher or enter ${names.field} explicitly`,
    );
  }
  const mean = sum / replicates;
  let relativeStandardError: number | null = null;
  if (replicates >= 2) {
    let squares = 0;
    for (let i = 0; i < concentrations.length; i++) if (concentrations[i] === 0) squares += (values[i]! - mean) ** 2;
    relativeStandardError = Math.sqrt(squares / (replicates - 1) / replicates) / mean;
  }
  return { value: mean, source: 'mean-of-zero-concentration-points', replicates, relativeStandardError };
}

/**
 * Every ratio I0/I shares the same I0, so an error in I0 moves every ratio by the same factor and
 * never shows in the residuals. Adds it to the fit's own standard errors by first-order
 * propagation (Bevington & Robinson, Data Reduction and Error Analysis, 3rd ed., ch. 3):
 * SE² = SE_fit² + (dK/d ln I0 · SE(I0)/I0)². With ∂y/∂I0 = y/I0 for each ratio y (the weights
 * 1/σ², σ ∝ y, scale together and cancel):
 * - intercept free: K and the intercept are linear in y, so dK/d ln I0 = K (and a for the intercept);
 * - intercept fixed at 1: K = Σw q (y − 1)/Σw q², so dK/d ln I0 = Σw q y / Σw q² = K + Σw q/Σw q²
 *   (the 1 the line is pinned to does not scale with I0).
 * Derived by hand and checked against a finite difference of K in reference-uncertainty.test.ts.
 *
 * @param ratioUncertainties - the 1-sigma of each ratio the fit was weighted by, if it was
 */
export function withReferenceUncertainty<T extends SternVolmerFit>(
  fit: T,
  reference: ReferenceValue,
  ratioUncertainties?: readonly number[],
): T {
  const relative = reference.relativeStandardError;
  if (relative === null || relative === 0) return fit;
  const widen = (estimate: ParameterEstimate, sensitivity: number) =>
    makeEstimate(estimate.value, Math.hypot(estimate.standardError, sensitivity * relative), fit.degreesOfFreedom);
  let kSensitivity = fit.kSv.value;
  if (fit.intercept === 'fixed-at-one') {
    const { concentrations, ratios } = fit.points;
    let sumQY = 0;
    let sumQQ = 0;
    // points holds the fit's own arrays (same length; ratioUncertainties too, checked by the fit).
    for (let i = 0; i < concentrations.length; i++) {
      const q = concentrations[i]!;
      const w = ratioUncertainties ? 1 / ratioUncertainties[i]! ** 2 : 1;
      sumQY += w * q * ratios[i]!;
      sumQQ += w * q * q;
    }
    kSensitivity = sumQY / sumQQ;
  }
  return {
    ...fit,
    kSv: widen(fit.kSv, kSensitivity),
    fittedIntercept: fit.fittedIntercept ? widen(fit.fittedIntercept, fit.fittedIntercept.value) : null,
  };
}
