import { EngineError } from '../core/engine-error';
import { requireFiniteArray, requirePositive } from '../core/validate';
import { residualRunsTest } from '../stats/runs-test';
import { decayFlag, type DecayFlag } from './decay-flag';
import { decayWorkspace, evaluateDecayModel, parameterCount, type DecayModelSetup } from './decay-model';
import { decayStartValues } from './decay-start-values';
import type { DecayComponent, DecayFit, DecayFitOptions, DecayInput } from './decay-types';
import { estimateDecayBackground } from './estimate-decay-background';
import { invertPositiveDefinite } from './invert-positive-definite';
import { meanLifetimes } from './mean-lifetimes';
import { decayObjective, minimiseDecayObjective } from './minimise-decay-objective';
import { prepareResponse, type PreparedResponse } from './prepare-response';
import { residualAutocorrelation } from './residual-autocorrelation';

/** A fit needs this many channels clearly above the background (issue 17; common practice). */
export const MIN_CHANNELS_ABOVE_BACKGROUND = 20;
/** Reduced chi-squared outside this band is flagged (common practice for counting data). */
export const CHI_SQUARED_BAND = { low: 0.8, high: 1.2 } as const;
/** Count rate above this share of the repetition rate risks pile-up (O'Connor & Phillips 1984: keep to 1-2 %, from memory). */
export const PILE_UP_SHARE = 0.02;
/** Peak counts below these are flagged: one exponential, two or three (common practice). */
export const PEAK_COUNTS_NEEDED = { single: 1000, multiple: 5000 } as const;
/** Residual tests count as structured below this p-value, or with |C(1)| above 3.29/sqrt(n) (two-sided 0.001). */
const STRUCTURE_P = 0.001;

const SQRT_N_LIMIT = 3.29;

/** The same checks as the engine's other inputs, with the counts' own words. */
function checkCounts(counts: ArrayLike<number>, field: string) {
  requireFiniteArray(counts, field);
  let total = 0;
  for (let i = 0; i < counts.length; i++) {
    if (counts[i]! < 0)
      throw new EngineError(
        'NEGATIVE_VALUE',
        `${field}[${i}]`,
        `counts cannot be negative, got ${counts[i]}`,
        'Upload the raw histogram, not background-subtracted data',
      );
    total += counts[i]!;
  }
  if (total === 0)
    throw new EngineError(
      'DEGENERATE_DATA',
      field,
      'every channel is zero',
      'Check that the right column holds the decay',
    );
}

/** Full fit set-up: method, range and the prepared response, with every refusal named. */
function setUp(input: DecayInput, options: DecayFitOptions) {
  const { counts } = input;
  const n = counts.length;
  requirePositive(input.channelWidth, 'channelWidth');
  if (n < MIN_CHANNELS_ABOVE_BACKGROUND)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'counts',
      `has ${n} channels; a decay needs at least ${MIN_CHANNELS_ABOVE_BACKGROUND}`,
    );
  checkCounts(counts, 'counts');
  const components = options.components ?? 1;
  if (![1, 2, 3].includes(components))
    throw new EngineError('INVALID_ARGUMENT', 'components', `must be 1, 2 or 3, got ${components}`);
  const response = input.response ?? null;
  const method = options.method ?? (response ? 'reconvolution' : 'tail');
  if (method === 'reconvolution' && !response)
    throw new EngineError(
      'INVALID_ARGUMENT',
      'response',
      'reconvolution needs the instrument response',
      'Add the response (IRF) as a file or a column, or choose a tail fit from a start channel',
    );
  let prepared: PreparedResponse | null = null;
  if (response) {
    if (response.length !== n)
      throw new EngineError('LENGTH_MISMATCH', 'response', `has ${response.length} channels but the decay has ${n}`);
    checkCounts(response, 'response');
    prepared = prepareResponse(response);
  }
  let peak = 0;
  for (let i = 1; i < n; i++) if (counts[i]! > counts[peak]!) peak = i;
  const autoStart = prepared
    ? Math.max(peak, Math.ceil(prepared.peakChannel + 2 * prepared.widthChannels))
    : peak + Math.max(2, Math.ceil(n / 200));
  const from = options.startChannel ?? (method === 'tail' ? Math.min(autoStart, n - 1) : 0);
  const to = options.endChannel ?? n - 1;
  if (!Number.isInteger(from) || from < 0 || from >= n - 1)
    throw new EngineError('INVALID_ARGUMENT', 'startChannel', `must be a channel from 0 to ${n - 2}, got ${from}`);
  if (!Number.isInteger(to) || to <= from || to >= n)
    throw new EngineError(
      'INVALID_ARGUMENT',
      'endChannel',
      `must be a channel after ${from} and at most ${n - 1}, got ${to}`,
    );
  return { components, method, prepared, from, to, peak };
}

const standardError = (covariance: number[][], k: number) => Math.sqrt(Math.max(0, covariance[k]![k]!));

/**
 * Fits a sum of one to three exponentials plus a constant background to a decay histogram
 * (time-correlated single photon counting or multichannel scaling), either by iterative
 * reconvolution with the measured instrument response and a fitted time shift, or as a tail
 * fit from a start channel (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006,
 * ch. 4; O'Connor & Phillips, Time-Correlated Single Photon Counting, 1984, ch. 6).
 * Estimator: Poisson maximum likelihood (default; Bajzer, Therneau, Sharp & Prendergast, Eur.
 * Biophys. J. 1991, 20, 247, from memory) or least squares weighted by 1/max(counts, 1), the
 * classical Neyman weighting. Standard errors come from the inverse Fisher information (the
 * weighted normal matrix for least squares) at the optimum. Start values from the log-linear
 * tail, peeled for more exponentials; lifetimes bounded to 0.05 channel .. 100 record lengths,
 * amplitudes and background to >= 0.
 *
 * @param input.counts - counts per channel (>= 0, at least 20 channels)
 * @param input.channelWidth - s
 * @param input.response - the instrument response on the same channels (reconvolution)
 * @param options - components (1-3), method, estimator, start/end channel, count and repetition rates
 * @throws EngineError NEGATIVE_VALUE (a negative count), DEGENERATE_DATA (all zero), TOO_FEW_POINTS
 *   (fewer than 20 channels above background), INVALID_ARGUMENT (no response for reconvolution,
 *   bad channels or component count), LENGTH_MISMATCH, FIT_DID_NOT_CONVERGE
 * @example fitDecay({ counts, channelWidth: 50e-12, response }, { components: 1 }).components[0].lifetime.value // ~4.1e-9
 */
export function fitDecay(input: DecayInput, options: DecayFitOptions = {}): DecayFit {
  const { counts, channelWidth } = input;
  const n = counts.length;
  const { components: K, method, prepared, from, to } = setUp(input, options);
  const estimator = options.estimator ?? 'poisson';
  const background = estimateDecayBackground(counts);
  let above = 0;
  const threshold = background + 3 * Math.sqrt(Math.max(background, 1));
  for (let i = from; i <= to; i++) if (counts[i]! > threshold) above++;
  if (above < MIN_CHANNELS_ABOVE_BACKGROUND)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'counts',
      `only ${above} channel${above === 1 ? '' : 's'} of the fit range stand clearly above the background (about ${Math.round(background)} counts); a fit needs at least ${MIN_CHANNELS_ABOVE_BACKGROUND}`,
      'Collect longer, or widen the fit range',
    );
  const setup: DecayModelSetup = {
    method,
    components: K,
    channels: n,
    response: prepared?.response ?? null,
    origin: method === 'tail' ? from : 0,
    end: to,
  };
  const p = parameterCount(setup);
  if (to - from + 1 <= p)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'endChannel',
      `the fit range holds ${to - from + 1} channels for ${p} parameters`,
    );
  const workspace = decayWorkspace(n);
  const context = {
    counts,
    from,
    to,
    background,
    responsePeak: prepared?.peakChannel ?? null,
    responseWidth: prepared?.widthChannels ?? null,
  };
  const shiftRange = Math.min(Math.max(5, Math.ceil(prepared?.widthChannels ?? 0)), Math.floor(n / 8));
  const start = decayStartValues(setup, context, shiftRange);
  const lower = [...new Array<number>(K).fill(Math.log(0.05)), ...new Array<number>(K + 1).fill(0)];
  const upper = [...new Array<number>(K).fill(Math.log(100 * n)), ...new Array<number>(K + 1).fill(Infinity)];
  if (method === 'reconvolution') {
    const reach = Math.max(2 * shiftRange, 10);
    lower.push(-reach);
    upper.push(reach);
  }
  const result = minimiseDecayObjective(setup, { counts, from, to, estimator }, start, { lower, upper }, workspace);
  const covariance = invertPositiveDefinite(result.information);
  if (!covariance || !Number.isFinite(result.objective))
    throw new EngineError(
      'FIT_DID_NOT_CONVERGE',
      'counts',
      `the ${K}-exponential model is not determined by these counts`,
      'Try fewer exponentials or another fit range',
    );
  const theta = result.parameters;

  // Components sorted by lifetime, in seconds.
  const order = Array.from({ length: K }, (_, k) => k).sort((a, b) => theta[a]! - theta[b]!);
  const lifetimes = order.map((k) => Math.exp(theta[k]!) * channelWidth);
  const amplitudes = order.map((k) => theta[K + k]!);
  const sortedCovariance = (() => {
    const index = [...order, ...order.map((k) => K + k)];
    return index.map((i) => index.map((j) => covariance[i]![j]!));
  })();
  const sumA = amplitudes.reduce((sum, a) => sum + a, 0);
  const sumAT = amplitudes.reduce((sum, a, k) => sum + a * lifetimes[k]!, 0);
  const componentsOut: DecayComponent[] = order.map((k, rank) => {
    // d(a_k / sum a)/d a_j = (delta_kj sum a - a_k) / (sum a)^2
    let variance = 0;
    for (let i = 0; i < K; i++)
      for (let j = 0; j < K; j++) {
        const gi = ((i === rank ? sumA : 0) - amplitudes[rank]!) / (sumA * sumA);
        const gj = ((j === rank ? sumA : 0) - amplitudes[rank]!) / (sumA * sumA);
        variance += gi * gj * sortedCovariance[K + i]![K + j]!;
      }
    return {
      lifetime: { value: lifetimes[rank]!, standardError: lifetimes[rank]! * standardError(covariance, k) },
      amplitude: { value: amplitudes[rank]!, standardError: standardError(covariance, K + k) },
      fractionalAmplitude: { value: amplitudes[rank]! / sumA, standardError: Math.sqrt(Math.max(0, variance)) },
      fractionalIntensity: (amplitudes[rank]! * lifetimes[rank]!) / sumAT,
    };
  });
  const means = meanLifetimes(lifetimes, amplitudes, sortedCovariance);

  // Goodness of fit: Pearson chi-squared, weighted residuals, their runs and lag-one correlation.
  const model = new Float64Array(n);
  evaluateDecayModel(setup, theta, model, null, workspace);
  const residuals = new Float64Array(to - from + 1);
  let chiSquared = 0;
  for (let i = from; i <= to; i++) {
    const m = Math.max(model[i]!, 1e-4);
    const r = (counts[i]! - m) / Math.sqrt(m);
    residuals[i - from] = r;
    chiSquared += r * r;
  }
  const degreesOfFreedom = to - from + 1 - p;
  const reducedChiSquared = chiSquared / degreesOfFreedom;
  const lagOne = residualAutocorrelation(residuals, 1)[1] ?? 0;
  const runs = residualRunsTest(residuals);

  const flags: DecayFlag[] = [];
  const ns = (seconds: number) => `${(seconds * 1e9).toPrecision(3)} ns`;
  if (reducedChiSquared < CHI_SQUARED_BAND.low || reducedChiSquared > CHI_SQUARED_BAND.high)
    flags.push(decayFlag('CHI_SQUARED_FAR_FROM_ONE', `reduced chi-squared ${reducedChiSquared.toFixed(2)}`));
  if (runs.pValue < STRUCTURE_P || Math.abs(lagOne) * Math.sqrt(residuals.length) > SQRT_N_LIMIT)
    flags.push(
      decayFlag(
        'STRUCTURED_RESIDUALS',
        `runs test p = ${runs.pValue.toPrecision(2)}, lag-one autocorrelation ${lagOne.toFixed(3)}`,
      ),
    );
  const responseWidth = prepared ? prepared.widthChannels * channelWidth : null;
  const shortest = lifetimes[0]!;
  if (responseWidth !== null && shortest < (method === 'tail' ? 2 * responseWidth : responseWidth / 10))
    flags.push(
      decayFlag('RESPONSE_TOO_WIDE', `shortest lifetime ${ns(shortest)}, response width ${ns(responseWidth)}`),
    );
  let peakCounts = 0;
  let whole = true;
  for (let i = 0; i < n; i++) {
    peakCounts = Math.max(peakCounts, counts[i]!);
    if (whole && !Number.isInteger(counts[i]!)) whole = false;
  }
  if (peakCounts < (K === 1 ? PEAK_COUNTS_NEEDED.single : PEAK_COUNTS_NEEDED.multiple))
    flags.push(decayFlag('FEW_PEAK_COUNTS', `${Math.round(peakCounts)} counts in the peak channel`));
  if (options.countRate !== undefined && options.repetitionRate !== undefined && options.repetitionRate > 0) {
    const share = options.countRate / options.repetitionRate;
    if (share > PILE_UP_SHARE)
      flags.push(decayFlag('PILE_UP_RISK', `count rate ${(share * 100).toFixed(1)} % of the repetition rate`));
  }
  if (shortest < 3 * channelWidth)
    flags.push(
      decayFlag('LIFETIME_WITHIN_FEW_CHANNELS', `shortest lifetime ${(shortest / channelWidth).toFixed(1)} channels`),
    );
  // A component at a lifetime bound, with no amplitude, or with an SE above its value is not carried by the data.
  const unsupported = componentsOut.filter(
    (component, rank) =>
      theta[order[rank]!]! <= lower[0]! + 1e-6 ||
      theta[order[rank]!]! >= upper[0]! - 1e-6 ||
      component.amplitude.value <= 1e-6 * sumA ||
      component.amplitude.standardError > component.amplitude.value ||
      component.lifetime.standardError > component.lifetime.value,
  );
  if (K > 1 && unsupported.length > 0)
    flags.push(
      decayFlag(
        'COMPONENT_NOT_SUPPORTED',
        unsupported
          .map(
            (component) =>
              `${ns(component.lifetime.value)} (amplitude ${component.amplitude.value.toPrecision(3)} ± ${component.amplitude.standardError.toPrecision(2)})`,
          )
          .join('; '),
      ),
    );
  if (!result.converged) flags.push(decayFlag('NOT_CONVERGED', `${result.iterations} iterations`));
  if (!whole) flags.push(decayFlag('COUNTS_NOT_WHOLE'));

  const shiftIndex = 2 * K + 1;
  return {
    method,
    estimator,
    components: componentsOut,
    background: { value: theta[2 * K]!, standardError: standardError(covariance, 2 * K) },
    shift:
      method === 'reconvolution'
        ? {
            value: theta[shiftIndex]! * channelWidth,
            standardError: standardError(covariance, shiftIndex) * channelWidth,
          }
        : null,
    amplitudeWeightedLifetime: means.amplitudeWeighted,
    intensityWeightedLifetime: means.intensityWeighted,
    chiSquared,
    degreesOfFreedom,
    reducedChiSquared,
    deviance: decayObjective({ counts, from, to, estimator: 'poisson' }, model),
    residualLagOne: lagOne,
    residualRunsPValue: runs.pValue,
    startChannel: from,
    endChannel: to,
    channelWidth,
    peakCounts,
    responseWidth,
    iterations: result.iterations,
    converged: result.converged,
    flags,
    parameters: theta,
  };
}
