/** What one pass over the points learns before any fitting. */
export interface PointScan {
  n: number;
  /** sums of w, w x and w y (w = 1 unweighted) */
  sumW: number;
  sumWx: number;
  sumWy: number;
  minX: number;
  maxX: number;
  minY: number;
  /** every x is greater than the one before it */
  increasing: boolean;
  /** number of distinct x as countDistinct counts them, or -1 when x is not in ascending order */
  distinctX: number;
  /** false when an x, y or weight is NaN or infinite (or a sum overflowed) */
  finite: boolean;
}

/**
 * One pass over paired points collecting what a straight-line fit and its checks need
 * first: weighted sums for the means, the ranges of x and y, whether x is ascending,
 * and the distinct x counted on the way (values within 1e-9 relative are one value, as
 * in countDistinct). Nothing throws here: a caller compares `finite`, `minX` and `minY`
 * with its own rules and only then runs the validators that name the bad entry, so good
 * data is read once instead of once per rule.
 *
 * @param x - abscissae
 * @param y - ordinates, same length (the caller checks the lengths)
 * @param weights - optional w_i, same length
 * @example scanPoints([0, 1, 1, 2], [1, 2, 2, 3]) // { distinctX: 3, increasing: false, minY: 1, ... }
 */
export function scanPoints(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): PointScan {
  const n = x.length;
  // Every index below is < n = x.length; y and weights have n entries (the callers check the lengths).
  let sumX = 0;
  let sumY = 0;
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let ascending = true;
  let increasing = true;
  let distinct = n > 0 ? 1 : 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    sumX += xi;
    sumY += yi;
    minX = Math.min(minX, xi);
    maxX = Math.max(maxX, xi);
    minY = Math.min(minY, yi);
  }
  for (let i = 1; i < n; i++) {
    const current = x[i]!;
    const previous = x[i - 1]!;
    const step = current - previous;
    if (!(step > 0)) {
      increasing = false;
      if (!(step >= 0)) ascending = false;
    }
    if (step > 1e-9 * Math.max(Math.abs(current), Math.abs(previous))) distinct++;
  }
  // Weighted sums in a loop of their own: a per-point "weight or 1" slows the common case.
  let sumW = n;
  let sumWx = sumX;
  let sumWy = sumY;
  if (weights !== undefined) {
    sumW = 0;
    sumWx = 0;
    sumWy = 0;
    for (let i = 0; i < n; i++) {
      const w = weights[i]!;
      sumW += w;
      sumWx += w * x[i]!;
      sumWy += w * y[i]!;
    }
  }
  // A NaN or infinity anywhere makes a sum NaN or infinite.
  const finite = Number.isFinite(sumW + sumWx + sumWy) && Number.isFinite(minX + maxX + minY);
  return { n, sumW, sumWx, sumWy, minX, maxX, minY, increasing, distinctX: ascending ? distinct : -1, finite };
}
