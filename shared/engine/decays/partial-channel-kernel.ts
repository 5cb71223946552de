/** integral_0^h t^m e^(-x t) dt for m = 0, 1, 2, by short series when x h is small (no cancellation). */
function moments(x: number, h: number): [number, number, number] {
  const u = x * h;
  if (u < 0.02) {
    const u2 = u * u;
    return [
      h * (1 - u / 2 + u2 / 6 - (u2 * u) / 24 + (u2 * u2) / 120),
      h * h * (1 / 2 - u / 3 + u2 / 8 - (u2 * u) / 30 + (u2 * u2) / 144),
      h * h * h * (1 / 3 - u / 4 + u2 / 10 - (u2 * u) / 36 + (u2 * u2) / 168),
    ];
  }
  const e = Math.exp(-u);
  return [-Math.expm1(-u) / x, (1 - e * (1 + u)) / (x * x), (2 - e * (u * u + 2 * u + 2)) / (x * x * x)];
}

/** integral over w in [from, from + h] of (c + s w) e^(-x w), and of the same times w. */
function piece(c: number, s: number, from: number, h: number, x: number): [number, number] {
  const [e0, e1, e2] = moments(x, h);
  const scale = Math.exp(-x * from);
  const constant = c + s * from;
  return [scale * (constant * e0 + s * e1), scale * (constant * from * e0 + (constant + s * from) * e1 + s * e2)];
}

/**
 * The weight of exp(-t/tau) between an emission channel and a response channel whose start
 * lies `a` channels before it, for -1 <= a <= 1, both channels one wide and the response spread
 * evenly over its channel: K(a) = integral of (1 - |D|) exp(-x (a + D)) over a + D > 0, D = u - v
 * of two uniform positions (triangular density), x = channel width / tau. For a >= 1 the weight
 * is g exp(-x a) (channelKernel); K(0) = k0. It is what lets the response move by a fraction of
 * a channel without interpolating it: the model stays smooth in the shift (O'Connor & Phillips,
 * Time-Correlated Single Photon Counting, 1984, ch. 6, for the binned treatment).
 * Also returns the first moment M(a) = integral of (1 - |D|) (a + D) exp(-x (a + D)), since
 * dK/dx = -M; and dK/da = (1 - |a|) - x K.
 *
 * @param a - lag in channels, from -1 to 1
 * @param x - channel width over lifetime (> 0)
 * @example partialChannelKernel(0, 0.1).value // 0.48374 (the same-channel k0 of channelKernel)
 */
export function partialChannelKernel(a: number, x: number): { value: number; moment: number } {
  if (a <= -1) return { value: 0, moment: 0 };
  if (a < 0) {
    const [value, moment] = piece(1 + a, -1, 0, 1 + a, x);
    return { value, moment };
  }
  const [rising, risingMoment] = piece(1 - a, 1, 0, a, x);
  const [falling, fallingMoment] = piece(1 + a, -1, a, 1, x);
  return { value: rising + falling, moment: risingMoment + fallingMoment };
}
