/** What one pass over the residuals of a line collects. */
export interface ResidualSums {
  /** y - (cy + slope (x - cx)), in input order (not weighted) */
  residuals: number[];
  /** sum w r^2, sum w r, sum w u r, sum w u^2 r with u = (x - cx) * toU */
  rss: number;
  sr: number;
  sur: number;
  su2r: number;
  /** runs of equal sign among the non-zero residuals, in input order */
  runs: number;
  positives: number;
  negatives: number;
}

/**
 * One pass forming the residuals of a fitted line, their (weighted) sum of squares, their
 * cross-products with u and u^2 for the added-x^2 test, and the sign runs for the runs
 * test (zero residuals carry no sign, as in residualRunsTest). The runs are counted
 * without branching on the sign, which noisy data would make unpredictable. Weighted
 * sums take a second loop over the residuals, keeping the unweighted loop lean.
 *
 * @param x - abscissae
 * @param y - ordinates
 * @param line - centre cx, offset cy and slope: fitted y = cy + slope (x - cx)
 * @param toU - 1 / spread of x about cx
 * @param weights - optional w_i
 * @example residualSums([0, 1, 2], [1, 3, 3], { cx: 1, cy: 7 / 3, slope: 1 }, 1).runs // 3
 */
export function residualSums(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  line: { cx: number; cy: number; slope: number },
  toU: number,
  weights?: ArrayLike<number>,
): ResidualSums {
  const { cx, cy, slope } = line;
  const n = x.length;
  // fill(0) keeps a packed array; `new Array(n)` alone turns slow for large n.
  const residuals: number[] = new Array<number>(n).fill(0);
  let rss = 0;
  let sr = 0;
  let sur = 0;
  let su2r = 0;
  let runs = 0;
  let positives = 0;
  let signed = 0;
  // -1 before the first signed residual: (p ^ -1) is negative, so the first one opens a run.
  let lastPositive = -1;
  // i < n = x.length; y and weights have n entries (the callers check the lengths), residuals too.
  for (let i = 0; i < n; i++) {
    const d = x[i]! - cx;
    const r = y[i]! - cy - slope * d;
    residuals[i] = r;
    rss += r * r;
    const u = d * toU;
    const ur = u * r;
    sr += r;
    sur += ur;
    su2r += ur * u;
    if (r !== 0) {
      const positive = (r > 0 ? 1 : 0) | 0;
      const change = positive ^ lastPositive;
      runs += (change >>> 31) | (change & 1);
      lastPositive = positive;
      positives += positive;
      signed++;
    }
  }
  if (weights !== undefined) {
    rss = 0;
    sr = 0;
    sur = 0;
    su2r = 0;
    for (let i = 0; i < n; i++) {
      const wr = weights[i]! * residuals[i]!;
      const u = (x[i]! - cx) * toU;
      rss += wr * residuals[i]!;
      sr += wr;
      sur += wr * u;
      su2r += wr * u * u;
    }
  }
  return { residuals, rss, sr, sur, su2r, runs, positives, negatives: signed - positives };
}
