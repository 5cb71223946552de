import cdf from '@stdlib/stats-base-dists-normal-cdf';

/**
 * Standard normal distribution function Phi(z), from `@stdlib/stats-base-dists-normal-cdf`.
 * Used for large-sample approximations.
 *
 * @param z - any finite number (or +-Infinity)
 * @example normalCdf(1.959963984540054) // 0.975
 */
export function normalCdf(z: number): number {
  return cdf(z, 0, 1);
}
