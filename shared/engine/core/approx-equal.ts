/**
 * Approximate equality with an explicit relative tolerance:
 * |actual - expected| <= relativeTolerance * max(|actual|, |expected|).
 * Two exact zeros are equal; NaN is never equal to anything.
 *
 * @param actual - any finite number
 * @param expected - any finite number
 * @param relativeTolerance - e.g. 1e-9 for "nine significant digits"; must be >= 0
 * @throws RangeError when the tolerance is negative or not finite
 * @example approxEqual(1.0000000001, 1, 1e-9) // true
 */
export function approxEqual(actual: number, expected: number, relativeTolerance: number): boolean {
  if (!(relativeTolerance >= 0) || !Number.isFinite(relativeTolerance)) {
    throw new RangeError('relativeTolerance must be a finite number >= 0');
  }
  if (actual === expected) return true;
  const scale = Math.max(Math.abs(actual), Math.abs(expected));
  return Math.abs(actual - expected) <= relativeTolerance * scale;
}

/** |actual - expected| / |expected| (or |actual| when expected is 0); for messages. */
export function relativeDifference(actual: number, expected: number): number {
  if (actual === expected) return 0;
  return Math.abs(actual - expected) / Math.max(Math.abs(expected), Number.MIN_VALUE);
}
