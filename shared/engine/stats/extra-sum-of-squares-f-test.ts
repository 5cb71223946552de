import { EngineError } from '../core/engine-error';
import { studentTQuantile975, studentTTwoSidedPValue } from './student-t';

export interface FTestResult {
  fStatistic: number;
  numeratorDegreesOfFreedom: 1;
  denominatorDegreesOfFreedom: number;
  pValue: number;
  /** F above which the larger model is preferred at the 5 % level */
  criticalValue95: number;
}

/**
 * Extra-sum-of-squares F test between nested least-squares models that differ by one
 * parameter (e.g. a line against a quadratic): F = (SS_reduced - SS_full) / (SS_full /
 * df_full) (Draper & Smith, Applied Regression Analysis, 3rd ed., sect. 6.1). With one
 * numerator degree of freedom F(1, df) is the square of Student's t(df), so the p-value
 * and the 5 % critical value come from the t distribution.
 *
 * @param reduced - residual sum of squares and df of the smaller model
 * @param full - residual sum of squares and df of the larger model (df = reduced df - 1)
 * @throws EngineError INVALID_ARGUMENT when the models do not differ by exactly one parameter or a sum of squares is negative
 * @example extraSumOfSquaresFTest({ residualSumOfSquares: 10, degreesOfFreedom: 10 }, { residualSumOfSquares: 5, degreesOfFreedom: 9 }).fStatistic // 9
 */
export function extraSumOfSquaresFTest(
  reduced: { residualSumOfSquares: number; degreesOfFreedom: number },
  full: { residualSumOfSquares: number; degreesOfFreedom: number },
): FTestResult {
  if (reduced.degreesOfFreedom - full.degreesOfFreedom !== 1 || full.degreesOfFreedom < 1) {
    throw new EngineError(
      'INVALID_ARGUMENT',
      'degreesOfFreedom',
      'the models must differ by exactly one parameter, with at least one residual degree of freedom left',
    );
  }
  if (!(reduced.residualSumOfSquares >= 0) || !(full.residualSumOfSquares >= 0)) {
    throw new EngineError('INVALID_ARGUMENT', 'residualSumOfSquares', 'must be finite and >= 0');
  }
  const df = full.degreesOfFreedom;
  const criticalValue95 = studentTQuantile975(df) ** 2;
  // Rounding can leave the larger model a hair worse than the smaller one: no evidence.
  const extra = Math.max(0, reduced.residualSumOfSquares - full.residualSumOfSquares);
  let fStatistic: number;
  if (full.residualSumOfSquares > 0) fStatistic = extra / (full.residualSumOfSquares / df);
  else fStatistic = extra > 0 ? Infinity : 0;
  const pValue = fStatistic === 0 ? 1 : studentTTwoSidedPValue(Math.sqrt(fStatistic), df);
  return { fStatistic, numeratorDegreesOfFreedom: 1, denominatorDegreesOfFreedom: df, pValue, criticalValue95 };
}
