/**
 * Constant background of a histogram (dark counts, room light, afterpulsing), for start values
 * and for cleaning the instrument response: the mean of the channels before the rise (more than
 * 1 % of the channels, or 3, before the first channel reaching a tenth of the peak) when there
 * are at least 10 of them, otherwise the mean of the last 5 % of the channels (at least 10).
 * Common practice in time-correlated single photon counting (O'Connor & Phillips, 1984, ch. 6).
 *
 * @param counts - counts per channel (validated by the caller)
 * @returns counts per channel, >= 0
 * @example estimateDecayBackground([2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 100, 50, 25, 12, 6, 3]) // 2
 */
export function estimateDecayBackground(counts: ArrayLike<number>): number {
  const n = counts.length;
  let peak = 0;
  for (let i = 0; i < n; i++) if (counts[i]! > peak) peak = counts[i]!;
  let rise = 0;
  while (rise < n && counts[rise]! < peak / 10) rise++;
  const margin = Math.max(3, Math.ceil(n / 100));
  const before = rise - margin;
  const mean = (from: number, to: number) => {
    let sum = 0;
    for (let i = from; i < to; i++) sum += counts[i]!;
    return sum / Math.max(1, to - from);
  };
  if (before >= 10) return Math.max(0, mean(0, before));
  const late = Math.min(n, Math.max(10, Math.ceil(n / 20)));
  return Math.max(0, mean(n - late, n));
}
