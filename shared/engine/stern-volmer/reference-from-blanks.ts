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
 * Every ratio I0/I shares the same I0, so an error in I0 scales K_SV (and the intercept)
 * as a whole and never shows in the residuals. Adds that relative error in quadrature
 * (first-order propagation) to the fit's own standard errors.
 */
export function withReferenceUncertainty<T extends SternVolmerFit>(fit: T, reference: ReferenceValue): T {
  const relative = reference.relativeStandardError;
  if (relative === null || relative === 0) return fit;
  const widen = (estimate: ParameterEstimate) =>
    makeEstimate(estimate.value, Math.hypot(estimate.standardError, estimate.value * relative), fit.degreesOfFreedom);
  return { ...fit, kSv: widen(fit.kSv), fittedIntercept: fit.fittedIntercept ? widen(fit.fittedIntercept) : null };
}
