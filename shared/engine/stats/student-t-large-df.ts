// Below this, the finite series of studentTTwoSidedPValue is short enough to sum.
export const LARGE_DF = 300;

/**
 * Two-sided p-value P(|T| >= |t|) of Student's t for many degrees of freedom, where the
 * finite series of Abramowitz & Stegun 26.7.3/26.7.4 would need df/2 terms. Uses
 * P = I_x(df/2, 1/2) with x = df/(df + t^2) (A&S 26.7.1 with 26.5.27), the regularized
 * incomplete beta evaluated by its continued fraction (A&S 26.5.8) with the modified
 * Lentz method, which takes about sqrt(df) steps; for t^2 < 1 the complement
 * 1 - I_(1-x)(1/2, df/2) (A&S 26.5.2), where the fraction converges fast. The constant
 * 1/B(a, 1/2) = Gamma(a + 1/2) / (Gamma(a) sqrt(pi)) comes from the asymptotic series
 * Gamma(a + 1/2)/Gamma(a) = sqrt(a) (1 - 1/(8a) + 1/(128a^2) + 5/(1024a^3) - 21/(32768a^4))
 * (from memory; checked against lgamma to 3e-14 at a = 150, and the p-values against the
 * @stdlib t quantile in the unit tests), whose next term is below 1e-13 for a >= 150.
 *
 * @param t - finite t statistic
 * @param degreesOfFreedom - integer > LARGE_DF (the caller checks)
 * @example studentTTwoSidedPValueLargeDf(1.959963984540054, 1e6) // ~0.05
 */
export function studentTTwoSidedPValueLargeDf(t: number, degreesOfFreedom: number): number {
  const a = degreesOfFreedom / 2;
  const t2 = t * t;
  const x = degreesOfFreedom / (degreesOfFreedom + t2);
  const oneMinusX = t2 / (degreesOfFreedom + t2);
  const gammaRatio = Math.sqrt(a) * (1 - 1 / (8 * a) + 1 / (128 * a * a) + 5 / (1024 * a ** 3) - 21 / (32768 * a ** 4));
  // x^a (1 - x)^(1/2) / B(a, 1/2), in logs: x^a underflows long before the p-value does.
  const front = Math.exp(a * Math.log(x)) * Math.sqrt(oneMinusX) * (gammaRatio / Math.sqrt(Math.PI));
  if (t2 >= 1) return Math.min(1, (front * continuedFraction(a, 0.5, x)) / a);
  return Math.max(0, 1 - (front * continuedFraction(0.5, a, oneMinusX)) / 0.5);
}

/** A&S 26.5.8 continued fraction for I_x(a, b) (without its front factor), modified Lentz. */
function continuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  d = 1 / (Math.abs(d) < tiny ? tiny : d);
  let h = d;
  for (let m = 1; m < 100_000; m++) {
    const even = (m * (b - m) * x) / ((a + 2 * m - 1) * (a + 2 * m));
    d = 1 + even * d;
    d = 1 / (Math.abs(d) < tiny ? tiny : d);
    c = 1 + even / c;
    c = Math.abs(c) < tiny ? tiny : c;
    h *= d * c;
    const odd = -((a + m) * (a + b + m) * x) / ((a + 2 * m) * (a + 2 * m + 1));
    d = 1 + odd * d;
    d = 1 / (Math.abs(d) < tiny ? tiny : d);
    c = 1 + odd / c;
    c = Math.abs(c) < tiny ? tiny : c;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return h;
}
