/** What every least-squares fit reports of its residuals (each fit adds its own R², defined as it says). */
export interface FitResiduals {
  /** y - fitted, in input order and in the units of y (not weighted) */
  residuals: number[];
  /** SS_res = sum of w_i r_i^2 (w_i = 1 unweighted) */
  residualSumOfSquares: number;
  /** s = sqrt(SS_res / degreesOfFreedom) */
  residualStandardDeviation: number;
  /** n minus the number of fitted parameters */
  degreesOfFreedom: number;
  n: number;
}
