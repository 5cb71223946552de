import type { AddedQuadraticTerm } from './added-quadratic-term';

/**
 * The x^2 term a straight line lacks, from the two projected sums of the Frisch–Waugh–Lovell
 * theorem (Frisch & Waugh, Econometrica 1933, 1, 387; Lovell, JASA 1963, 58, 993): with r the
 * line's residuals and z the part of u^2 the line's own terms do not explain, the coefficient of
 * u^2 is z.r / z.z, its variance s^2 / z.z, and the residual sum of squares falls by (z.r)^2 / z.z
 * (never below zero). u = (x - centre) / spread, so the x^2 coefficient and its standard error
 * are those of u^2 divided by spread^2. Shared by addedQuadraticTerm and fitLineWithCurvature,
 * which form z.z and z.r in their own ways.
 *
 * @param zz - z.z (weighted), greater than zero (the callers return null first when it is not)
 * @param zr - z.r (weighted), units of y
 * @param line - the line's residual sum of squares and degrees of freedom
 * @param spread - the scale of u, units of x
 * @example quadraticTermFromProjection(1, 0.5, { residualSumOfSquares: 1, degreesOfFreedom: 2 }, 1).coefficient // 0.5
 */
export function quadraticTermFromProjection(
  zz: number,
  zr: number,
  line: { residualSumOfSquares: number; degreesOfFreedom: number },
  spread: number,
): AddedQuadraticTerm {
  const extraSumOfSquares = Math.min(line.residualSumOfSquares, (zr * zr) / zz);
  const residualSumOfSquares = line.residualSumOfSquares - extraSumOfSquares;
  const degreesOfFreedom = line.degreesOfFreedom - 1;
  const spreadSquared = spread * spread;
  return {
    coefficient: zr / zz / spreadSquared,
    standardError: Math.sqrt(residualSumOfSquares / degreesOfFreedom / zz) / spreadSquared,
    extraSumOfSquares,
    residualSumOfSquares,
    degreesOfFreedom,
  };
}
