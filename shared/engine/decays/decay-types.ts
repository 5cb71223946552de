import type { DecayFlag } from './decay-flag';

/** How a decay is fitted: the engine's options, all with defaults. */
export interface DecayFitOptions {
  /** number of exponentials, 1 to 3 (default 1) */
  components?: 1 | 2 | 3;
  /**
   * 'reconvolution' (default when a response is given): the sum of exponentials convolved with
   * the measured response, shifted by a fitted offset; 'tail': the exponentials alone, fitted
   * from `startChannel` on, for lifetimes much longer than the response.
   */
  method?: 'reconvolution' | 'tail';
  /** 'poisson' (default): maximum likelihood for counts; 'least-squares': weights 1/max(counts, 1) */
  estimator?: 'poisson' | 'least-squares';
  /** first channel of the fit (0-based); default 0 for reconvolution, after the peak for a tail fit */
  startChannel?: number;
  /** last channel of the fit (0-based, included); default the last channel */
  endChannel?: number;
  /** detected photons per second, with repetitionRate for the pile-up check */
  countRate?: number;
  /** excitation pulses per second */
  repetitionRate?: number;
}

/** One decay histogram: counts per channel on an evenly spaced time axis. */
export interface DecayInput {
  /** counts per channel (>= 0) */
  counts: ArrayLike<number>;
  /** channel width, s */
  channelWidth: number;
  /** the instrument response per channel on the same channels (needed for reconvolution) */
  response?: ArrayLike<number> | null;
}

/** A value with its standard error (from the inverse Fisher information). */
export interface DecayEstimate {
  value: number;
  standardError: number;
}

export interface DecayComponent {
  /** lifetime, s */
  lifetime: DecayEstimate;
  /** pre-exponential factor: counts per channel of this exponential at its time zero */
  amplitude: DecayEstimate;
  /** a_i / sum(a) */
  fractionalAmplitude: DecayEstimate;
  /** a_i tau_i / sum(a tau): the share of the emitted photons */
  fractionalIntensity: number;
}

/** What fitDecay found, in SI units (s); counts per channel for amplitudes and background. */
export interface DecayFit {
  method: 'reconvolution' | 'tail';
  estimator: 'poisson' | 'least-squares';
  /** sorted from shortest to longest lifetime */
  components: DecayComponent[];
  /** constant background, counts per channel */
  background: DecayEstimate;
  /** response shift, s (reconvolution only) */
  shift: DecayEstimate | null;
  /** sum(a tau)/sum(a) */
  amplitudeWeightedLifetime: DecayEstimate;
  /** sum(a tau^2)/sum(a tau) */
  intensityWeightedLifetime: DecayEstimate;
  /** Pearson chi^2 = sum((c - m)^2 / m) over the fitted channels */
  chiSquared: number;
  degreesOfFreedom: number;
  reducedChiSquared: number;
  /** 2 sum(m - c + c ln(c/m)), the Poisson deviance at the optimum */
  deviance: number;
  /** lag-one autocorrelation of the weighted residuals */
  residualLagOne: number;
  /** p-value of the runs test on the signs of the residuals (small: residuals come in blocks) */
  residualRunsPValue: number;
  startChannel: number;
  endChannel: number;
  channelWidth: number;
  /** largest count of the decay */
  peakCounts: number;
  /** full width at half maximum of the response, s; null without a response */
  responseWidth: number | null;
  iterations: number;
  converged: boolean;
  flags: DecayFlag[];
  /** the exact parameters, so the curves can be drawn again (see decayCurves) */
  parameters: number[];
}
