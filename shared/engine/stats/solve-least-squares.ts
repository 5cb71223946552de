import { EngineError } from '../core/engine-error';

export interface LeastSquaresSolution {
  coefficients: number[];
  /** (X^T W X)^-1, the unscaled covariance of the coefficients */
  unscaledCovariance: number[][];
  /** sum of w_i r_i^2 */
  residualSumOfSquares: number;
}

/**
 * Weighted linear least squares by Householder QR (Golub & Van Loan, Matrix
 * Computations, 4th ed., sect. 5.3): the design is never squared, so conditioning is
 * that of X, not of X^T X. Meant for a few, already well-scaled columns.
 *
 * @param columns - design matrix by column, each of length n (not modified)
 * @param y - observations, length n
 * @param weights - optional w_i > 0 (1/sigma_i^2); rows are scaled by sqrt(w_i)
 * @throws EngineError DEGENERATE_DATA when the columns are (numerically) dependent
 * @example solveLeastSquares([[1, 1, 1], [0, 1, 2]], [1, 3, 5]).coefficients // [1, 2]
 */
export function solveLeastSquares(
  columns: ArrayLike<number>[],
  y: ArrayLike<number>,
  weights?: ArrayLike<number>,
): LeastSquaresSolution {
  const n = y.length;
  const p = columns.length;
  if (n <= p) throw new EngineError('TOO_FEW_POINTS', 'y', `needs more than ${p} points, got ${n}`);
  // Indices below: rows i < n (every column has n entries, as y), columns j, k < p; r and the
  // coefficients are p x p and p long.
  const a = columns.map((column) => Float64Array.from(column));
  const b = Float64Array.from(y);
  if (weights) {
    for (let i = 0; i < n; i++) {
      const root = Math.sqrt(weights[i]!);
      b[i]! *= root;
      for (const column of a) column[i]! *= root;
    }
  }
  const columnNorms = a.map((column) => Math.sqrt(sumSquares(column)));
  const r: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let k = 0; k < p; k++) {
    const ak = a[k]!;
    let norm = 0;
    for (let i = k; i < n; i++) norm += ak[i]! * ak[i]!;
    norm = Math.sqrt(norm);
    if (norm <= 1e-12 * columnNorms[k]!) {
      throw new EngineError(
        'DEGENERATE_DATA',
        'x',
        'the model terms cannot be told apart with these points',
        'Use more distinct concentrations',
      );
    }
    const alpha = ak[k]! > 0 ? -norm : norm;
    ak[k]! -= alpha;
    let vv = 0;
    for (let i = k; i < n; i++) vv += ak[i]! * ak[i]!;
    applyReflection(ak, b, k, n, vv);
    for (let j = k + 1; j < p; j++) {
      applyReflection(ak, a[j]!, k, n, vv);
      r[k]![j] = a[j]![k]!;
    }
    r[k]![k] = alpha;
  }
  const coefficients = new Array<number>(p).fill(0);
  for (let k = p - 1; k >= 0; k--) {
    let s = b[k]!;
    for (let j = k + 1; j < p; j++) s -= r[k]![j]! * coefficients[j]!;
    coefficients[k] = s / r[k]![k]!;
  }
  let residualSumOfSquares = 0;
  for (let i = p; i < n; i++) residualSumOfSquares += b[i]! * b[i]!;
  return { coefficients, unscaledCovariance: inverseTimesTranspose(r), residualSumOfSquares };
}

function sumSquares(column: Float64Array): number {
  let s = 0;
  // i < column.length: an element.
  for (let i = 0; i < column.length; i++) s += column[i]! * column[i]!;
  return s;
}

/** target <- (I - 2 v v^T / v^T v) target, v = reflector[k..n). */
function applyReflection(reflector: Float64Array, target: Float64Array, k: number, n: number, vv: number): void {
  let dot = 0;
  // k <= i < n, and both arrays have n entries.
  for (let i = k; i < n; i++) dot += reflector[i]! * target[i]!;
  const factor = (2 * dot) / vv;
  for (let i = k; i < n; i++) target[i]! -= factor * reflector[i]!;
}

/** (R^T R)^-1 = R^-1 R^-T for upper-triangular R. */
function inverseTimesTranspose(r: number[][]): number[][] {
  const p = r.length;
  const inv: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  // r, inv and out are p x p and every index below runs from 0 to p - 1.
  for (let j = 0; j < p; j++) {
    inv[j]![j] = 1 / r[j]![j]!;
    for (let i = j - 1; i >= 0; i--) {
      let s = 0;
      for (let k = i + 1; k <= j; k++) s += r[i]![k]! * inv[k]![j]!;
      inv[i]![j] = -s / r[i]![i]!;
    }
  }
  const out: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < p; i++) {
    for (let j = 0; j < p; j++) {
      let s = 0;
      for (let k = Math.max(i, j); k < p; k++) s += inv[i]![k]! * inv[j]![k]!;
      out[i]![j] = s;
    }
  }
  return out;
}
