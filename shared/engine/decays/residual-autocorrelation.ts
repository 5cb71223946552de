/**
 * Autocorrelation of weighted residuals, C(j) = [sum_i r_i r_(i+j) / (n - j)] / [sum_i r_i^2 / n],
 * for lags 0..maxLag; C(0) = 1. Random counting noise gives values scattered about zero
 * (about +-2/sqrt(n)); a wave means the model misses part of the decay (Grinvald & Steinberg,
 * Anal. Biochem. 1974, 59, 583, from memory; O'Connor & Phillips, 1984, ch. 6).
 *
 * @param residuals - weighted residuals in channel order
 * @param maxLag - largest lag (default: half the residuals)
 * @example residualAutocorrelation([1, -1, 1, -1], 1) // [1, -1]
 */
export function residualAutocorrelation(residuals: ArrayLike<number>, maxLag?: number): number[] {
  const n = residuals.length;
  const lags = Math.min(maxLag ?? Math.floor(n / 2), n - 1);
  let power = 0;
  for (let i = 0; i < n; i++) power += residuals[i]! * residuals[i]!;
  power /= n;
  const result: number[] = [];
  for (let lag = 0; lag <= lags; lag++) {
    let sum = 0;
    for (let i = 0; i + lag < n; i++) sum += residuals[i]! * residuals[i + lag]!;
    result.push(power > 0 ? sum / (n - lag) / power : 0);
  }
  return result;
}
