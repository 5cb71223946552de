import { SingularValueDecomposition } from 'ml-matrix';
import { EngineError } from '../core/engine-error';
import { requireFiniteArray } from '../core/validate';

/**
 * Singular values of a real matrix, largest first, by the one-sided Golub–Kahan–Reinsch SVD
 * of `ml-matrix` (Golub & Van Loan, Matrix Computations, 4th ed., sect. 8.6). The singular
 * values are the square roots of the eigenvalues of AᵀA.
 *
 * @param rows - the matrix as rows of equal length, at least 1 x 1, finite entries
 * @throws EngineError DEGENERATE_DATA (no rows or no columns), LENGTH_MISMATCH (ragged rows), NON_FINITE_VALUE
 * @example singularValues([[3, 0], [4, 5]]) // [6.7082… (√45), 2.2360… (√5)]
 */
export function singularValues(rows: readonly (readonly number[])[]): number[] {
  const columns = rows[0]?.length ?? 0;
  if (rows.length === 0 || columns === 0)
    throw new EngineError('DEGENERATE_DATA', 'rows', 'a matrix needs at least one row and one column');
  rows.forEach((row, i) => {
    if (row.length !== columns)
      throw new EngineError('LENGTH_MISMATCH', `rows[${i}]`, `has ${row.length} entries but rows[0] has ${columns}`);
    requireFiniteArray(row, `rows[${i}]`);
  });
  const svd = new SingularValueDecomposition(
    rows.map((row) => [...row]),
    { computeLeftSingularVectors: false, computeRightSingularVectors: false, autoTranspose: true },
  );
  return [...svd.diagonal].sort((a, b) => b - a);
}
