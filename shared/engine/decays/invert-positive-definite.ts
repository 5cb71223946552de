/**
 * Inverse of a small symmetric positive-definite matrix by Cholesky factorisation (Golub & Van
 * Loan, Matrix Computations, 4th ed., sect. 4.2), after scaling it to unit diagonal so that
 * parameters of very different sizes (counts and log-lifetimes) do not spoil the pivots.
 * Returns null when the matrix is not positive definite (a parameter the data do not fix).
 *
 * @param matrix - p x p, row-major, symmetric (only the lower triangle is read)
 * @example invertPositiveDefinite([[4, 2], [2, 3]]) // [[0.375, -0.25], [-0.25, 0.5]]
 */
export function invertPositiveDefinite(matrix: readonly (readonly number[])[]): number[][] | null {
  const p = matrix.length;
  const scale = matrix.map((row, i) => {
    const diagonal = row[i]!;
    return diagonal > 0 && Number.isFinite(diagonal) ? 1 / Math.sqrt(diagonal) : NaN;
  });
  if (scale.some((value) => Number.isNaN(value))) return null;
  // L L^T = D A D, with D = diag(scale)
  const lower = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = matrix[i]![j]! * scale[i]! * scale[j]!;
      for (let k = 0; k < j; k++) sum -= lower[i]![k]! * lower[j]![k]!;
      if (i === j) {
        if (!(sum > 1e-14)) return null;
        lower[i]![i] = Math.sqrt(sum);
      } else lower[i]![j] = sum / lower[j]![j]!;
    }
  }
  // Invert L (lower triangular), then (D A D)^-1 = L^-T L^-1, and A^-1 = D (D A D)^-1 D.
  const inverseLower = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < p; i++) {
    inverseLower[i]![i] = 1 / lower[i]![i]!;
    for (let j = 0; j < i; j++) {
      let sum = 0;
      for (let k = j; k < i; k++) sum -= lower[i]![k]! * inverseLower[k]![j]!;
      inverseLower[i]![j] = sum / lower[i]![i]!;
    }
  }
  const inverse = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let k = i; k < p; k++) sum += inverseLower[k]![i]! * inverseLower[k]![j]!;
      const value = sum * scale[i]! * scale[j]!;
      inverse[i]![j] = value;
      inverse[j]![i] = value;
    }
  }
  return inverse;
}
