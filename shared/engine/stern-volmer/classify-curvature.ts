import type { AddedQuadraticTerm } from '../stats/added-quadratic-term';
import { extraSumOfSquaresFTest } from '../stats/extra-sum-of-squares-f-test';
import type { RunsTestResult } from '../stats/runs-test';
import type { CurvatureDiagnosis } from './diagnose-curvature';

// Both checks use the conventional 5 % level (common practice).
const SIGNIFICANCE = 0.05;

/**
 * The verdict of diagnoseCurvature from its parts: the extra-sum-of-squares F test of the
 * line against the quadratic decides the shape (sign of the x^2 coefficient), the runs
 * test whether the residuals show a pattern. Shared by diagnoseCurvature and
 * fitSternVolmer, which computes the parts in its own passes.
 *
 * @param linear - residual sum of squares and df of the line
 * @param quadratic - the added x^2 term, or null when it cannot be fitted
 * @param runs - runs test on the line's residuals in concentration order
 * @example classifyCurvature({ residualSumOfSquares: 10, degreesOfFreedom: 10 }, null, runs).shape // 'linear'
 */
export function classifyCurvature(
  linear: { residualSumOfSquares: number; degreesOfFreedom: number },
  quadratic: AddedQuadraticTerm | null,
  runs: RunsTestResult,
): CurvatureDiagnosis {
  const residualPattern = runs.pValue < SIGNIFICANCE;
  if (!quadratic) return { shape: 'linear', fTest: null, quadraticCoefficient: null, runs, residualPattern };
  const fTest = extraSumOfSquaresFTest(linear, quadratic);
  const b2 = quadratic.coefficient;
  const shape = fTest.pValue < SIGNIFICANCE ? (b2 > 0 ? 'upward' : 'downward') : 'linear';
  return {
    shape,
    fTest,
    quadraticCoefficient: { value: b2, standardError: quadratic.standardError },
    runs,
    residualPattern,
  };
}
