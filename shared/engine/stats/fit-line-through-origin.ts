import { EngineError } from '../core/engine-error';
import { requireFitData, requireSameLength } from '../core/validate';
import type { FitResiduals } from './fit-residuals';

/** Least-squares line through the origin, y = slope * x. */
export interface OriginLineFit extends FitResiduals {
  slope: number;
  slopeStandardError: number;
  /** uncentred, as NIST StRD uses without an intercept: 1 - SS_res / sum w_i y_i^2 */
  rSquared: number;
}

/**
 * Least-squares straight line through the origin (regression without intercept):
 * slope = sum w x y / sum w x^2, SE = s / sqrt(sum w x^2), s^2 = SS_res / (n - 1).
 * Checked against NIST StRD NoInt1 and NoInt2.
 *
 * @param x - abscissae, finite, not all zero
 * @param y - ordinates, same length, at least 2 points
 * @param weights - optional relative weights w_i > 0
 * @throws EngineError TOO_FEW_POINTS, LENGTH_MISMATCH, NON_FINITE_VALUE, NON_POSITIVE_VALUE, DEGENERATE_DATA
 * @example fitLineThroughOrigin([4, 5, 6], [3, 4, 4]).slope // 0.7272727272727273 (NIST NoInt2)
 */
export function fitLineThroughOrigin(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  weights?: ArrayLike<number>,
): OriginLineFit {
  const n = x.length;
  requireSameLength(x, y, 'x', 'y');
  if (n < 2)
    throw new EngineError('TOO_FEW_POINTS', 'x', `a line through the origin needs at least 2 points, got ${n}`);
  requireFitData(x, y, weights);
  // Every index i below is < n = x.length; y and weights have n entries (checked just above).
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1;
    sxx += w * x[i]! * x[i]!;
    sxy += w * x[i]! * y[i]!;
    syy += w * y[i]! * y[i]!;
  }
  if (!(sxx > 0)) throw new EngineError('DEGENERATE_DATA', 'x', 'all x values are zero, so no slope can be fitted');
  const slope = sxy / sxx;
  // fill(0) keeps a packed double array; `new Array(n)` alone turns slow for large n.
  const residuals: number[] = new Array<number>(n).fill(0);
  let residualSumOfSquares = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i]! - slope * x[i]!;
    residuals[i] = r;
    residualSumOfSquares += (weights ? weights[i]! : 1) * r * r;
  }
  const degreesOfFreedom = n - 1;
  const variance = residualSumOfSquares / degreesOfFreedom;
  return {
    slope,
    slopeStandardError: Math.sqrt(variance / sxx),
    residuals,
    residualSumOfSquares,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom,
    n,
    rSquared: syy > 0 ? 1 - residualSumOfSquares / syy : 1,
  };
}
