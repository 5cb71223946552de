import type { DecayEstimate } from './decay-types';

/**
 * Amplitude-weighted sum(a tau)/sum(a) and intensity-weighted sum(a tau^2)/sum(a tau) mean
 * lifetimes (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 4), with
 * standard errors by first-order propagation through the covariance of (ln tau_k, a_k).
 *
 * @param lifetimes - tau_k (any time unit; results in the same unit)
 * @param amplitudes - a_k
 * @param covariance - covariance of [ln tau_1..ln tau_K, a_1..a_K] (extra rows ignored)
 * @example meanLifetimes([1, 3], [1, 1], [[0,0,0,0],[0,0,0,0],[0,0,0,0],[0,0,0,0]]).amplitudeWeighted.value // 2
 */
export function meanLifetimes(
  lifetimes: readonly number[],
  amplitudes: readonly number[],
  covariance: readonly (readonly number[])[],
): { amplitudeWeighted: DecayEstimate; intensityWeighted: DecayEstimate } {
  const K = lifetimes.length;
  let sumA = 0;
  let sumAT = 0;
  let sumAT2 = 0;
  for (let k = 0; k < K; k++) {
    sumA += amplitudes[k]!;
    sumAT += amplitudes[k]! * lifetimes[k]!;
    sumAT2 += amplitudes[k]! * lifetimes[k]! ** 2;
  }
  const amplitudeMean = sumAT / sumA;
  const intensityMean = sumAT2 / sumAT;
  // gradients by [ln tau_k ..., a_k ...]
  const gradientA: number[] = [];
  const gradientI: number[] = [];
  for (let k = 0; k < K; k++) {
    const a = amplitudes[k]!;
    const tau = lifetimes[k]!;
    gradientA[k] = (a * tau) / sumA;
    gradientA[K + k] = (tau - amplitudeMean) / sumA;
    gradientI[k] = (2 * a * tau * tau * sumAT - a * tau * sumAT2) / (sumAT * sumAT);
    gradientI[K + k] = (tau * tau * sumAT - tau * sumAT2) / (sumAT * sumAT);
  }
  const variance = (gradient: number[]) => {
    let total = 0;
    for (let i = 0; i < 2 * K; i++)
      for (let j = 0; j < 2 * K; j++) total += gradient[i]! * covariance[i]![j]! * gradient[j]!;
    return Math.max(0, total);
  };
  return {
    amplitudeWeighted: { value: amplitudeMean, standardError: Math.sqrt(variance(gradientA)) },
    intensityWeighted: { value: intensityMean, standardError: Math.sqrt(variance(gradientI)) },
  };
}
