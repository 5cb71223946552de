import { EngineError } from '../core/engine-error';
import type { AddedQuadraticTerm } from './added-quadratic-term';
import type { FitResiduals } from './fit-residuals';
import { centredSums } from './centred-sums';
import { quadraticTermFromProjection } from './quadratic-term-from-projection';
import { residualSums } from './residual-sums';
import type { PointScan } from './scan-points';

/** A straight line, its residual sign runs and what an added x^2 term would change. */
export interface LineWithCurvature extends FitResiduals {
  slope: number;
  /** 0 through the origin */
  intercept: number;
  slopeStandardError: number;
  /** 0 through the origin */
  interceptStandardError: number;
  /** centred with an intercept, uncentred through the origin */
  rSquared: number;
  /** as addedQuadraticTerm; null when x^2 cannot be told apart from the line */
  quadratic: AddedQuadraticTerm | null;
  /** residual sign runs in input order, counted only when x is increasing (else null) */
  signRuns: { runs: number; positives: number; negatives: number } | null;
}

/**
 * Weighted least-squares line (free intercept, or through the origin) together with the
 * inputs of its curvature checks, in two passes after scanPoints. The first pass forms
 * centred sums (Sxx, Sxy, Syy, as fitLine and fitLineThroughOrigin) and the moments of
 * u = (x - centre)/spread up to u^4; the second the residuals, the sign runs and the
 * residual cross-products with u and u^2. The x^2 term then follows in closed form by the
 * Frisch–Waugh–Lovell theorem exactly as in addedQuadraticTerm: z = u^2 - c0 - c1 u with
 * c0 = S2/W, c1 = S3/S2 gives z.z = S4 - c0 S2 - c1 S3 + 2 c0 c1 S1 and z.r = S(u^2 r) -
 * c0 S(r) - c1 S(u r). Centring and scaling keep every power of order one, which is what
 * lets these sums replace a refit (checked against NIST StRD Norris, NoInt1/2 and Pontius).
 *
 * @param x - abscissae, finite (validated by the caller from the scan)
 * @param y - ordinates, finite
 * @param scan - scanPoints(x, y, weights)
 * @param options.throughOrigin - fit (y - yOffset) = slope x
 * @param options.yOffset - subtracted from every y first (1 for ratios with the intercept fixed at 1)
 * @throws EngineError DEGENERATE_DATA when all x are equal (or all zero through the origin)
 * @example fitLineWithCurvature([1, 2, 3, 4], [3, 5, 7, 9], scanPoints([1, 2, 3, 4], [3, 5, 7, 9])).slope // 2
 */
export function fitLineWithCurvature(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  scan: PointScan,
  options: { weights?: ArrayLike<number>; throughOrigin?: boolean; yOffset?: number } = {},
): LineWithCurvature {
  const { weights, throughOrigin = false, yOffset = 0 } = options;
  const { n, sumW, minX, maxX } = scan;
  const centreX = throughOrigin ? 0 : scan.sumWx / sumW;
  // dy = y - yShift is y - yOffset through the origin and y - mean(y) with an intercept.
  const yShift = throughOrigin ? yOffset : scan.sumWy / sumW;
  const spread = throughOrigin ? Math.max(Math.abs(minX), Math.abs(maxX)) : Math.max(maxX - centreX, centreX - minX);
  const toU = 1 / spread;
  const { sxx, sxy, syy, s1, s3, s4 } = centredSums(x, y, centreX, yShift, toU, weights);
  if (!(sxx > 0)) {
    throw new EngineError(
      'DEGENERATE_DATA',
      'x',
      throughOrigin
        ? 'all x values are zero, so no slope can be fitted'
        : 'all x values are equal, so no slope can be fitted',
    );
  }
  const slope = sxy / sxx;
  const { residuals, rss, sr, sur, su2r, runs, positives, negatives } = residualSums(
    x,
    y,
    { cx: centreX, cy: yShift, slope },
    toU,
    weights,
  );
  const degreesOfFreedom = n - (throughOrigin ? 1 : 2);
  const variance = rss / degreesOfFreedom;
  const moments = { sumW, s1, s2: sxx * toU * toU, s3, s4, sr, sur, su2r };
  return {
    slope,
    intercept: throughOrigin ? 0 : yShift - yOffset - slope * centreX,
    slopeStandardError: Math.sqrt(variance / sxx),
    interceptStandardError: throughOrigin ? 0 : Math.sqrt(variance * (1 / sumW + (centreX * centreX) / sxx)),
    residuals,
    residualSumOfSquares: rss,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom,
    n,
    // All y equal and fitted exactly: report a perfect fit rather than 0/0.
    rSquared: syy > 0 ? 1 - rss / syy : 1,
    quadratic: quadraticFromMoments(moments, rss, degreesOfFreedom, spread, throughOrigin),
    signRuns: scan.increasing ? { runs, positives, negatives } : null,
  };
}

function quadraticFromMoments(
  m: { sumW: number; s1: number; s2: number; s3: number; s4: number; sr: number; sur: number; su2r: number },
  lineResidualSumOfSquares: number,
  lineDegreesOfFreedom: number,
  spread: number,
  throughOrigin: boolean,
): AddedQuadraticTerm | null {
  if (!(spread > 0) || lineDegreesOfFreedom < 2) return null;
  const c0 = throughOrigin ? 0 : m.s2 / m.sumW;
  const c1 = m.s3 / m.s2;
  const zz = m.s4 - c0 * m.s2 - c1 * m.s3 + 2 * c0 * c1 * m.s1;
  // Same cut-off as addedQuadraticTerm: x^2 indistinguishable from 1 and x (< 3 distinct x).
  if (!(zz > 1e-12 * m.s4)) return null;
  const zr = m.su2r - c0 * m.sr - c1 * m.sur;
  return quadraticTermFromProjection(
    zz,
    zr,
    { residualSumOfSquares: lineResidualSumOfSquares, degreesOfFreedom: lineDegreesOfFreedom },
    spread,
  );
}
