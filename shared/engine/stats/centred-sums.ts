/** Centred sums of a line fit and the moments of the scaled abscissa u. */
export interface CentredSums {
  /** sum w (x - cx)^2, sum w (x - cx)(y - cy), sum w (y - cy)^2 */
  sxx: number;
  sxy: number;
  syy: number;
  /** sum w u, sum w u^3, sum w u^4 with u = (x - cx) * toU */
  s1: number;
  s3: number;
  s4: number;
}

/**
 * One pass forming the centred sums of a straight-line fit (as fitLine and
 * fitLineThroughOrigin use them, which is what keeps NIST StRD Norris at 12 digits) and
 * the third and fourth moments of u = (x - cx) toU that the added-x^2 test needs. The
 * unweighted loop is kept apart from the weighted one: a per-point "weight or 1" makes
 * V8 compile the common case several times slower.
 *
 * @param x - abscissae
 * @param y - ordinates
 * @param cx - centre of x (0 through the origin)
 * @param cy - subtracted from y (mean of y, or the fixed intercept through the origin)
 * @param toU - 1 / spread of x about cx
 * @param weights - optional w_i
 * @example centredSums([0, 1, 2], [1, 2, 3], 1, 2, 1).sxy // 2
 */
export function centredSums(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  cx: number,
  cy: number,
  toU: number,
  weights?: ArrayLike<number>,
): CentredSums {
  const n = x.length;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  let s1 = 0;
  let s3 = 0;
  let s4 = 0;
  // i < n = x.length; y and weights have n entries (the callers check the lengths).
  if (weights === undefined) {
    for (let i = 0; i < n; i++) {
      const d = x[i]! - cx;
      const dy = y[i]! - cy;
      sxx += d * d;
      sxy += d * dy;
      syy += dy * dy;
      const u = d * toU;
      const u2 = u * u;
      s1 += u;
      s3 += u2 * u;
      s4 += u2 * u2;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const w = weights[i]!;
      const d = x[i]! - cx;
      const dy = y[i]! - cy;
      sxx += w * d * d;
      sxy += w * d * dy;
      syy += w * dy * dy;
      const u = d * toU;
      const wu2 = w * u * u;
      s1 += w * u;
      s3 += wu2 * u;
      s4 += wu2 * u * u;
    }
  }
  return { sxx, sxy, syy, s1, s3, s4 };
}
