/**
 * The weights of exp(-t/tau) between histogram channels, for a response spread evenly over its
 * channel and counts summed over theirs (the usual treatment of a binned prompt in recursive
 * reconvolution: Grinvald & Steinberg, Anal. Biochem. 1974, 59, 583, from memory; O'Connor &
 * Phillips, Time-Correlated Single Photon Counting, 1984, ch. 6). With x = channel width / tau
 * and q = exp(-x):
 *   same channel:   k0 = 1/x - (1 - q)/x^2
 *   d channels on:  k_d = g q^d,  g = (1 - q)(1/q - 1)/x^2 = 2 (cosh x - 1)/x^2
 * Both tend to the point-sampled 1/2 and q^d as x -> 0. The derivatives by x feed the
 * lifetime's column of the Jacobian. Short series below x = 1e-3 avoid cancellation.
 *
 * @param x - channel width over lifetime (> 0; the fit keeps it at or below 20)
 * @returns k0, g and their derivatives by x
 * @example channelKernel(0.01).k0 // 0.49833... (1/2 - x/6 + x^2/24)
 */
export function channelKernel(x: number): { k0: number; dk0: number; g: number; dg: number; q: number } {
  const q = Math.exp(-x);
  if (x < 1e-3) {
    const x2 = x * x;
    return {
      k0: 0.5 - x / 6 + x2 / 24 - (x2 * x) / 120,
      dk0: -1 / 6 + x / 12 - x2 / 40,
      g: 1 + x2 / 12 + (x2 * x2) / 360,
      dg: x / 6 + (x2 * x) / 90,
      q,
    };
  }
  const oneMinusQ = -Math.expm1(-x);
  const x2 = x * x;
  const coshMinusOne = Math.expm1(x) / 2 + Math.expm1(-x) / 2;
  const sinh = Math.expm1(x) / 2 - Math.expm1(-x) / 2;
  return {
    k0: 1 / x - oneMinusQ / x2,
    dk0: -1 / x2 - q / x2 + (2 * oneMinusQ) / (x2 * x),
    g: (2 * coshMinusOne) / x2,
    dg: (2 * sinh) / x2 - (4 * coshMinusOne) / (x2 * x),
    q,
  };
}
