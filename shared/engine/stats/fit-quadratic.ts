import { EngineError } from '../core/engine-error';
import { requireFitData } from '../core/validate';
import type { FitResiduals } from './fit-residuals';
import { solveLeastSquares } from './solve-least-squares';

/** Quadratic least-squares fit y = b0 + b1 x + b2 x^2 (b0 = 0 when through the origin). */
export interface QuadraticFit extends FitResiduals {
  /** [b0, b1, b2]; b0 is exactly 0 for a fit through the origin */
  coefficients: [number, number, number];
  /** standard errors of [b0, b1, b2] (0 for a b0 that was not fitted) */
  standardErrors: [number, number, number];
  /** covariance of b1 and b2 */
  covarianceB1B2: number;
  /** centred with an intercept, uncentred through the origin (as NIST StRD) */
  rSquared: number;
}

/**
 * Quadratic polynomial by least squares. x is centred and scaled to u = (x - m)/h before
 * the columns 1, u, u^2 are formed (only scaled, u = x/h, through the origin), then
 * solved by Householder QR and mapped back to powers of x with the exact linear
 * transform, covariance included. Forming x and x^2 directly fails on NIST StRD
 * Pontius (x up to 3e6, x^2 up to 9e12); this way it reproduces Pontius to better than
 * 1e-9 relative.
 *
 * @param x - abscissae (at least 3 distinct)
 * @param y - ordinates, same length; at least 4 points (3 through the origin)
 * @param options.weights - optional relative weights w_i > 0
 * @param options.throughOrigin - fit y = b1 x + b2 x^2 without a constant term
 * @throws EngineError TOO_FEW_POINTS, LENGTH_MISMATCH, NON_FINITE_VALUE, NON_POSITIVE_VALUE, DEGENERATE_DATA
 * @example fitQuadratic([0, 1, 2, 3], [1, 2, 5, 10]).coefficients // [1, 0, 1] (to rounding)
 */
export function fitQuadratic(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  options: { weights?: ArrayLike<number>; throughOrigin?: boolean } = {},
): QuadraticFit {
  const { weights, throughOrigin = false } = options;
  const n = x.length;
  requireFitData(x, y, weights);
  const parameters = throughOrigin ? 2 : 3;
  if (n <= parameters) {
    throw new EngineError('TOO_FEW_POINTS', 'x', `a quadratic needs more than ${parameters} points, got ${n}`);
  }
  // Every index i below is < n; y and weights have n entries (checked above). g holds the three
  // coefficients of (1, u, u^2), padded with 0 for the constant through the origin.
  let centre = 0;
  if (!throughOrigin) {
    for (let i = 0; i < n; i++) centre += x[i]!;
    centre /= n;
  }
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(x[i]! - centre));
  if (!(scale > 0)) throw new EngineError('DEGENERATE_DATA', 'x', 'all x values are equal');
  const u = new Float64Array(n);
  const u2 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    u[i] = (x[i]! - centre) / scale;
    u2[i] = u[i]! * u[i]!;
  }
  const columns = throughOrigin ? [u, u2] : [new Float64Array(n).fill(1), u, u2];
  const solution = solveLeastSquares(columns, y, weights);
  const g = throughOrigin ? [0, ...solution.coefficients] : solution.coefficients;
  // fill(0) keeps a packed double array; `new Array(n)` alone turns slow for large n.
  const residuals: number[] = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) residuals[i] = y[i]! - (g[0]! + g[1]! * u[i]! + g[2]! * u2[i]!);

  // b = T g maps coefficients of (1, u, u^2) to those of (1, x, x^2).
  const m = centre / scale;
  const t = [
    [1, -m, m * m],
    [0, 1 / scale, (-2 * m) / scale],
    [0, 0, 1 / (scale * scale)],
  ];
  const gCovariance = throughOrigin ? padCovariance(solution.unscaledCovariance) : solution.unscaledCovariance;
  const degreesOfFreedom = n - parameters;
  const variance = solution.residualSumOfSquares / degreesOfFreedom;
  const b = t.map((row) => row[0]! * g[0]! + row[1]! * g[1]! + row[2]! * g[2]!);
  const covariance = t.map((rowI) => t.map((rowJ) => variance * bilinear(rowI, gCovariance, rowJ)));
  let syy = 0;
  let sumW = 0;
  let meanY = 0;
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1;
    sumW += w;
    meanY += w * y[i]!;
  }
  meanY = throughOrigin ? 0 : meanY / sumW;
  for (let i = 0; i < n; i++) syy += (weights ? weights[i]! : 1) * (y[i]! - meanY) ** 2;
  return {
    coefficients: [throughOrigin ? 0 : b[0]!, b[1]!, b[2]!],
    standardErrors: [Math.sqrt(covariance[0]![0]!), Math.sqrt(covariance[1]![1]!), Math.sqrt(covariance[2]![2]!)],
    covarianceB1B2: covariance[1]![2]!,
    residuals,
    residualSumOfSquares: solution.residualSumOfSquares,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom,
    n,
    rSquared: syy > 0 ? 1 - solution.residualSumOfSquares / syy : 1,
  };
}

/** The 2 x 2 covariance of (u, u^2) through the origin, in the 3 x 3 layout of (1, u, u^2). */
function padCovariance(c: number[][]): number[][] {
  return [
    [0, 0, 0],
    [0, c[0]![0]!, c[0]![1]!],
    [0, c[1]![0]!, c[1]![1]!],
  ];
}

/** a^T M b for 3-vectors and a 3 x 3 matrix (every index below is 0, 1 or 2). */
function bilinear(a: number[], matrix: number[][], b: number[]): number {
  let s = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) s += a[i]! * matrix[i]![j]! * b[j]!;
  return s;
}
