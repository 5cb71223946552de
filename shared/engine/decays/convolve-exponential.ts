import { channelKernel } from './channel-kernel';
import { partialChannelKernel } from './partial-channel-kernel';

/**
 * Convolution of a histogrammed instrument response, moved later by `shift` channels (any
 * fraction), with exp(-t/tau), channel by channel, by the recursive form: P[i] = q (P[i-1] +
 * R[i-1]) carries every earlier channel's share, so the whole curve costs O(n) instead of the
 * O(n^2) double loop (Grinvald & Steinberg, Anal. Biochem. 1974, 59, 583, from memory;
 * O'Connor & Phillips, Time-Correlated Single Photon Counting, 1984, ch. 6; Lakowicz,
 * Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 4). The response is taken as
 * spread evenly over each channel and moved as a whole (no interpolation), so the curve is
 * smooth in both the lifetime and the shift. With shift = k + f (k whole, 0 <= f < 1) and R'
 * the response moved by k:
 *   y[i] = K(-f) R'[i] + K(1 - f) R'[i-1] + g e^(x f) (P[i] - q R'[i-1])
 * (partialChannelKernel for K, channelKernel for g; x = channel width / tau, q = e^-x).
 * Optional outputs: dy/d(ln tau) and dy/d(shift), analytically (Q[i] = q Q[i-1] + P[i] gives
 * the lag-weighted sum that d q^d/dx needs).
 *
 * @param response - the instrument response per channel (normalised to sum 1 for amplitudes in counts)
 * @param shift - channels, positive = later
 * @param x - channel width over lifetime (> 0)
 * @param out - length n: receives y
 * @param lifetimeSlope - optional length n: receives dy/d(ln tau)
 * @param shiftSlope - optional length n: receives dy/d(shift)
 * @example
 * const y = new Float64Array(3);
 * convolveExponential([1, 0, 0], 0, 0.1, y); // y = [0.4837, 0.9056, 0.8194] (k0, g q, g q^2)
 */
export function convolveExponential(
  response: ArrayLike<number>,
  shift: number,
  x: number,
  out: Float64Array,
  lifetimeSlope?: Float64Array,
  shiftSlope?: Float64Array,
): void {
  const whole = Math.floor(shift);
  const f = shift - whole;
  const { g, dg, q } = channelKernel(x);
  const near = partialChannelKernel(-f, x);
  const next = partialChannelKernel(1 - f, x);
  const growth = Math.exp(x * f);
  const A = near.value;
  const B = next.value;
  const G = g * growth;
  // d/dx
  const Ax = -near.moment;
  const Bx = -next.moment;
  const Gx = (dg + g * f) * growth;
  // d/df: dK/da = (1 - |a|) - x K, with a = -f and a = 1 - f
  const Af = -(1 - f - x * A);
  const Bf = -(f - x * B);
  const Gf = x * G;
  const n = out.length;
  const length = response.length;
  let carried = 0;
  let lagged = 0;
  let previous = 0;
  // A negative shift moves response channels before channel 0: they still feed the later ones.
  for (let i = Math.min(0, whole); i < n; i++) {
    carried = q * (carried + previous);
    lagged = q * lagged + carried;
    const source = i - whole;
    const here = source >= 0 && source < length ? response[source]! : 0;
    if (i < 0) {
      previous = here;
      continue;
    }
    const rest = carried - q * previous;
    out[i] = A * here + B * previous + G * rest;
    if (lifetimeSlope) lifetimeSlope[i] = -x * (Ax * here + Bx * previous + Gx * rest + G * (q * previous - lagged));
    if (shiftSlope) shiftSlope[i] = Af * here + Bf * previous + Gf * rest;
    previous = here;
  }
}
