import { EngineError } from '../core/engine-error';
import { normalCdf } from './normal-cdf';

/**
 * The z with P(Z > z) = p for a standard normal Z: Φ(−z) = p solved by bisection on
 * `normalCdf` (`@stdlib/stats-base-dists-normal-cdf`), in the lower tail so that p down to
 * 1e-300 keeps its relative precision. Used for a Bonferroni threshold over many tests
 * (Bonferroni; common practice), where p is tiny and speed does not matter.
 *
 * @param p - upper-tail probability, 0 < p < 1
 * @throws EngineError INVALID_ARGUMENT when p is not in (0, 1)
 * @example normalUpperQuantile(0.025) // 1.959963984540054 (to about 1e-12)
 */
export function normalUpperQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new EngineError('INVALID_ARGUMENT', 'p', `must lie between 0 and 1, got ${p}`);
  let low = -40;
  let high = 40;
  // Φ(−z) falls as z rises; 200 halvings of 80 reach far below double precision.
  for (let step = 0; step < 200 && high - low > 1e-13; step++) {
    const middle = (low + high) / 2;
    if (normalCdf(-middle) > p) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}
