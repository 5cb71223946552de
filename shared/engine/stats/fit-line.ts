import { EngineError } from '../core/engine-error';
import { requireFitData, requireSameLength } from '../core/validate';
import type { FitResiduals } from './fit-residuals';

/** Straight-line least-squares fit y = intercept + slope * x with its statistics. */
export interface LineFit extends FitResiduals {
  slope: number;
  intercept: number;
  slopeStandardError: number;
  interceptStandardError: number;
  /** covariance of (slope, intercept), needed for quantities derived from both */
  slopeInterceptCovariance: number;
  /** centred: 1 - SS_res / sum w_i (y_i - ybar_w)^2 */
  rSquared: number;
}

/**
 * Ordinary (or weighted) least-squares straight line with a free intercept, with
 * standard errors s^2 (X^T W X)^-1 as in NIST StRD (Norris), s^2 = SS_res/(n-2).
 *
 * One path, weighted or not: centred sums (slope = Sxy / Sxx about the weighted means), which
 * keep their digits when x is offset far from zero. NIST StRD Norris is met to nine digits
 * (nist-strd.test.ts); `ml-regression-simple-linear` is the independent cross-check in the
 * tests only. Weights are relative: the covariance is scaled by the residual variance.
 *
 * @param x - abscissae, any finite values with at least two distinct
 * @param y - ordinates, same length, at least 3 points
 * @param weights - optional w_i > 0 (typically 1 / sigma_i^2)
 * @throws EngineError TOO_FEW_POINTS, LENGTH_MISMATCH, NON_FINITE_VALUE, NON_POSITIVE_VALUE (weights), DEGENERATE_DATA
 * @example fitLine([1, 2, 3, 4], [3, 5, 7, 9]).slope // 2
 */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): LineFit {
  const n = x.length;
  requireSameLength(x, y, 'x', 'y');
  if (n < 3)
    throw new EngineError('TOO_FEW_POINTS', 'x', `a line with a free intercept needs at least 3 points, got ${n}`);
  requireFitData(x, y, weights);
  // Every index i below is < n = x.length; y and weights have n entries (checked just above).
  let sumW = 0;
  let sumWx = 0;
  let sumWy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1;
    sumW += w;
    sumWx += w * x[i]!;
    sumWy += w * y[i]!;
  }
  const meanX = sumWx / sumW;
  const meanY = sumWy / sumW;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1;
    const dx = x[i]! - meanX;
    const dy = y[i]! - meanY;
    sxx += w * dx * dx;
    sxy += w * dx * dy;
    syy += w * dy * dy;
  }
  if (!(sxx > 0)) throw new EngineError('DEGENERATE_DATA', 'x', 'all x values are equal, so no slope can be fitted');
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  // fill(0) keeps a packed double array; `new Array(n)` alone turns slow for large n.
  const residuals: number[] = new Array<number>(n).fill(0);
  let residualSumOfSquares = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i]! - (intercept + slope * x[i]!);
    residuals[i] = r;
    residualSumOfSquares += (weights ? weights[i]! : 1) * r * r;
  }
  const degreesOfFreedom = n - 2;
  const variance = residualSumOfSquares / degreesOfFreedom;
  return {
    slope,
    intercept,
    slopeStandardError: Math.sqrt(variance / sxx),
    interceptStandardError: Math.sqrt(variance * (1 / sumW + (meanX * meanX) / sxx)),
    slopeInterceptCovariance: (-meanX * variance) / sxx,
    residuals,
    residualSumOfSquares,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom,
    n,
    // All y equal and fitted exactly: report a perfect fit rather than 0/0.
    rSquared: syy > 0 ? 1 - residualSumOfSquares / syy : 1,
  };
}
