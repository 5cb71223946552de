import type { FTestResult } from '../stats/extra-sum-of-squares-f-test';
import { fitLine } from '../stats/fit-line';
import { fitLineThroughOrigin } from '../stats/fit-line-through-origin';
import { addedQuadraticTerm } from '../stats/added-quadratic-term';
import { residualRunsTest, type RunsTestResult } from '../stats/runs-test';
import { classifyCurvature } from './classify-curvature';
import { residualsInConcentrationOrder } from './residuals-in-concentration-order';

export type InterceptMode = 'free' | 'fixed-at-one';

export interface CurvatureDiagnosis {
  /** 'upward'/'downward' when the quadratic term is significant at the 5 % level */
  shape: 'linear' | 'upward' | 'downward';
  /** null when there are too few points to fit the quadratic with a residual left */
  fTest: FTestResult | null;
  /** quadratic coefficient of the ratio in [Q]^2 (M^-2) with its standard error */
  quadraticCoefficient: { value: number; standardError: number } | null;
  runs: RunsTestResult;
  /** runs test significant at the 5 % level */
  residualPattern: boolean;
}

/**
 * Tells a straight Stern–Volmer plot from a curved one: extra-sum-of-squares F test of
 * the line against a quadratic in [Q] (same intercept treatment; the quadratic comes from
 * the line's residuals by addedQuadraticTerm, no refit), and the Wald–Wolfowitz
 * runs test on the signs of the line's residuals taken in order of concentration (ties
 * ordered by residual, so the outcome does not depend on input order). See Lakowicz,
 * Principles of Fluorescence Spectroscopy, 3rd ed. (2006), ch. 8, for what the two
 * curvatures mean.
 *
 * @param concentrations - [Q] in mol/L, >= 0
 * @param ratios - I0/I or tau0/tau
 * @param options.intercept - 'free' or 'fixed-at-one' (ratio - 1 through the origin)
 * @param options.weights - optional relative weights
 * @param options.linear - the line already fitted to the same data, to avoid refitting
 * @throws EngineError from the underlying fits (too few points, degenerate data)
 * @example diagnoseCurvature([0, 1, 2, 3, 4, 5], [1, 2.1, 3.4, 4.9, 6.6, 8.5], { intercept: 'free' }).shape // 'upward'
 */
export function diagnoseCurvature(
  concentrations: ArrayLike<number>,
  ratios: ArrayLike<number>,
  options: {
    intercept: InterceptMode;
    weights?: ArrayLike<number>;
    linear?: { residualSumOfSquares: number; degreesOfFreedom: number; residuals: ArrayLike<number> };
  },
): CurvatureDiagnosis {
  const { intercept, weights } = options;
  const throughOrigin = intercept === 'fixed-at-one';
  const linear =
    options.linear ??
    (throughOrigin
      ? fitLineThroughOrigin(
          concentrations,
          Array.from(ratios, (ratio) => ratio - 1),
          weights,
        )
      : fitLine(concentrations, ratios, weights));
  const runs = residualRunsTest(residualsInConcentrationOrder(concentrations, linear.residuals));
  const quadratic = addedQuadraticTerm(concentrations, linear, { throughOrigin, ...(weights ? { weights } : {}) });
  return classifyCurvature(linear, quadratic, runs);
}
