import cdf from '@stdlib/stats-base-dists-t-cdf';
import quantile from '@stdlib/stats-base-dists-t-quantile';
import { EngineError } from '../core/engine-error';

// Quantiles are cached per degrees of freedom: every fit asks for the same few, and the
// quantile function (an inverse incomplete beta) costs far more than a whole small fit.
// Integer df (every least-squares fit) are cached in an array; fractional df (Welch) are not.
const quantile975Cache: number[] = [];

/**
 * Upper 97.5 % quantile of Student's t with `degreesOfFreedom`, the multiplier of a
 * two-sided 95 % confidence interval. Computed by `@stdlib/stats-base-dists-t-quantile`.
 *
 * @param degreesOfFreedom - > 0 (need not be an integer: Welch–Satterthwaite df are not)
 * @throws EngineError INVALID_ARGUMENT when the degrees of freedom are not positive
 * @example studentTQuantile975(10) // 2.2281388519862744
 */
export function studentTQuantile975(degreesOfFreedom: number): number {
  const cached = quantile975Cache[degreesOfFreedom];
  if (cached !== undefined) return cached;
  if (!(degreesOfFreedom > 0) || !Number.isFinite(degreesOfFreedom)) {
    throw new EngineError('INVALID_ARGUMENT', 'degreesOfFreedom', `must be a positive number, got ${degreesOfFreedom}`);
  }
  const value = quantile(0.975, degreesOfFreedom);
  if (Number.isInteger(degreesOfFreedom) && degreesOfFreedom <= 100_000) quantile975Cache[degreesOfFreedom] = value;
  return value;
}

/**
 * Two-sided p-value P(|T| >= |t|) of Student's t with integer degrees of freedom: 2 F(-|t|),
 * with F from `@stdlib/stats-base-dists-t-cdf`, evaluated in the lower tail so that tiny
 * p-values keep their relative precision.
 *
 * @param t - the t statistic (any finite value, or +-Infinity giving 0)
 * @param degreesOfFreedom - a positive integer
 * @throws EngineError INVALID_ARGUMENT for non-integer or non-positive df, or NaN t
 * @example studentTTwoSidedPValue(2.2281388519862744, 10) // 0.05 (to about 1e-15)
 */
export function studentTTwoSidedPValue(t: number, degreesOfFreedom: number): number {
  if (!Number.isInteger(degreesOfFreedom) || degreesOfFreedom < 1) {
    throw new EngineError(
      'INVALID_ARGUMENT',
      'degreesOfFreedom',
      `must be a positive integer, got ${degreesOfFreedom}`,
    );
  }
  if (Number.isNaN(t)) throw new EngineError('INVALID_ARGUMENT', 't', 'is NaN');
  if (!Number.isFinite(t)) return 0;
  return Math.min(1, 2 * cdf(-Math.abs(t), degreesOfFreedom));
}
