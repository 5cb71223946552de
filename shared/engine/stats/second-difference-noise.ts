/** 1.4826 turns a median absolute value into a normal SD (Hampel, JASA 1974; common practice). */
const MAD_TO_SD = 1.4826;

/**
 * Noise SD of one reading of a sampled curve from its second differences: for white noise of
 * SD σ, Var(y[i−1] − 2y[i] + y[i+1]) = (1 + 4 + 1)σ² = 6σ², and a smooth curve adds only its
 * curvature times the grid step squared. The median absolute second difference, scaled by
 * 1.4826 (MAD to SD for a normal) and divided by √6, gives σ robustly against a few spikes
 * (Hampel, J. Am. Stat. Assoc. 1974, 69, 383 for the MAD; the 6σ² is common practice). On a
 * coarse grid the curvature of a sharp band raises the estimate (it errs high, not low).
 *
 * @param values - readings on an even grid, at least 3
 * @returns σ in the readings' unit (0 for a straight line without noise)
 * @example secondDifferenceNoise([1, 2, 3, 4]) // 0
 */
export function secondDifferenceNoise(values: readonly number[]): number {
  const differences: number[] = [];
  // 1 <= i < length - 1: i - 1, i and i + 1 index elements.
  for (let i = 1; i < values.length - 1; i++)
    differences.push(Math.abs(values[i - 1]! - 2 * values[i]! + values[i + 1]!));
  if (differences.length === 0) return 0;
  differences.sort((a, b) => a - b);
  const middle = differences.length >> 1;
  const median =
    differences.length % 2 === 1 ? differences[middle]! : (differences[middle - 1]! + differences[middle]!) / 2;
  return (MAD_TO_SD * median) / Math.sqrt(6);
}
