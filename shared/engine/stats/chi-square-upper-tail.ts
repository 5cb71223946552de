import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { requireNonNegative, requirePositive } from '../core/validate';

/**
 * Upper-tail probability P(X ≥ x) of the χ² distribution with k degrees of freedom, as
 * 1 − F(x; k) from `@stdlib/stats-base-dists-chisquare-cdf` (values below about 1e-16 come
 * out as 0).
 *
 * @param x - the statistic, ≥ 0
 * @param degreesOfFreedom - k > 0
 * @throws EngineError NEGATIVE_VALUE, NON_POSITIVE_VALUE, NON_FINITE_VALUE
 * @example chiSquareUpperTail(2, 2) // 0.36787944… (e^-1: for k = 2 the tail is e^(-x/2))
 */
export function chiSquareUpperTail(x: number, degreesOfFreedom: number): number {
  requireNonNegative(x, 'x');
  requirePositive(degreesOfFreedom, 'degreesOfFreedom');
  return Math.max(0, 1 - chisquareCdf(x, degreesOfFreedom));
}
