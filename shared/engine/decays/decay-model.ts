import { convolveExponential } from './convolve-exponential';

/**
 * The fixed part of a decay model. Parameters travel as one vector:
 * [ln(tau_1/w) .. ln(tau_K/w), a_1 .. a_K, background, shift (reconvolution only)],
 * with w the channel width, a_k in counts per channel and the shift in channels.
 */
export interface DecayModelSetup {
  method: 'reconvolution' | 'tail';
  components: number;
  /** channels of the histogram */
  channels: number;
  /** background-free response normalised to sum 1 (reconvolution) */
  response: Float64Array | null;
  /** tail fit: the channel taken as time zero (the first fitted channel) */
  origin: number;
  /** last channel the model is needed for */
  end: number;
}

export const parameterCount = (setup: Pick<DecayModelSetup, 'method' | 'components'>) =>
  2 * setup.components + (setup.method === 'reconvolution' ? 2 : 1);

/** Scratch arrays of one fit, made once. */
export interface DecayWorkspace {
  curve: Float64Array;
  curveSlope: Float64Array;
  shiftCurve: Float64Array;
}

export const decayWorkspace = (channels: number): DecayWorkspace => ({
  curve: new Float64Array(channels),
  curveSlope: new Float64Array(channels),
  shiftCurve: new Float64Array(channels),
});

/**
 * The expected counts m_i of a sum of exponentials plus a constant background, and (when
 * `jacobian` is given) dm_i/d(parameter) for every parameter, analytically:
 * - reconvolution: m = sum_k a_k (R(shift) * exp(-t/tau_k)) + b, each convolution by the
 *   recursive form with the response moved by the fitted shift (convolveExponential);
 * - tail: m_i = sum_k a_k exp(-(i - origin) w/tau_k) + b.
 * Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 4; O'Connor &
 * Phillips, Time-Correlated Single Photon Counting, 1984, ch. 6.
 *
 * @param setup - the model's fixed part
 * @param parameters - the parameter vector (see DecayModelSetup)
 * @param values - length `channels`: receives m (channels after `end` are left as they are)
 * @param jacobian - optional, one column per parameter, each of length `channels`
 * @example evaluateDecayModel({ method: 'tail', components: 1, channels: 2, response: null, origin: 0, end: 1 }, [0, 100, 1], out, null, decayWorkspace(2)) // out = [101, 37.79]
 */
export function evaluateDecayModel(
  setup: DecayModelSetup,
  parameters: readonly number[],
  values: Float64Array,
  jacobian: Float64Array[] | null,
  workspace: DecayWorkspace,
): void {
  const K = setup.components;
  const background = parameters[2 * K]!;
  const last = Math.min(setup.end, setup.channels - 1);
  if (setup.method === 'tail') {
    for (let i = setup.origin; i <= last; i++) values[i] = background;
    for (let k = 0; k < K; k++) {
      const x = Math.exp(-parameters[k]!);
      const amplitude = parameters[K + k]!;
      for (let i = setup.origin; i <= last; i++) {
        const lag = i - setup.origin;
        const shape = Math.exp(-lag * x);
        values[i]! += amplitude * shape;
        if (jacobian) {
          jacobian[k]![i] = amplitude * shape * lag * x;
          jacobian[K + k]![i] = shape;
        }
      }
    }
    if (jacobian) for (let i = setup.origin; i <= last; i++) jacobian[2 * K]![i] = 1;
    return;
  }
  const { curve, curveSlope, shiftCurve } = workspace;
  const n = last + 1;
  const view = (array: Float64Array) => (n === array.length ? array : array.subarray(0, n));
  const shift = parameters[2 * K + 1]!;
  for (let i = 0; i < n; i++) values[i] = background;
  const shiftColumn = jacobian?.[2 * K + 1];
  if (shiftColumn) shiftColumn.fill(0, 0, n);
  for (let k = 0; k < K; k++) {
    const x = Math.exp(-parameters[k]!);
    const amplitude = parameters[K + k]!;
    convolveExponential(
      setup.response!,
      shift,
      x,
      view(curve),
      jacobian ? view(curveSlope) : undefined,
      jacobian ? view(shiftCurve) : undefined,
    );
    for (let i = 0; i < n; i++) values[i]! += amplitude * curve[i]!;
    if (jacobian) {
      const lifetimeColumn = jacobian[k]!;
      const amplitudeColumn = jacobian[K + k]!;
      for (let i = 0; i < n; i++) {
        lifetimeColumn[i] = amplitude * curveSlope[i]!;
        amplitudeColumn[i] = curve[i]!;
        shiftColumn![i]! += amplitude * shiftCurve[i]!;
      }
    }
  }
  if (jacobian) jacobian[2 * K]!.fill(1, 0, n);
}
