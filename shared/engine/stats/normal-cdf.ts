/**
 * Standard normal distribution function Phi(z) = erfc(-z / sqrt 2) / 2. erfc from its
 * Maclaurin series for |x| < 2 and from the Laplace continued fraction beyond
 * (Abramowitz & Stegun 7.1.5 and 7.1.14), evaluated by the modified Lentz method.
 * Used for large-sample approximations, where its accuracy (better than 1e-9 relative) is ample.
 *
 * @param z - any finite number (or +-Infinity)
 * @example normalCdf(1.959963984540054) // 0.975
 */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

function erfc(x: number): number {
  if (x === Infinity) return 0;
  if (x === -Infinity) return 2;
  if (Math.abs(x) < 2) return 1 - erfSeries(x);
  if (x < 0) return 2 - erfcContinuedFraction(-x);
  return erfcContinuedFraction(x);
}

/** erf x = 2/sqrt(pi) sum (-1)^n x^(2n+1) / (n! (2n+1)) */
function erfSeries(x: number): number {
  const x2 = x * x;
  let power = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    power *= -x2 / n;
    const term = power / (2 * n + 1);
    sum += term;
    if (Math.abs(term) < 1e-17 * Math.abs(sum)) break;
  }
  return (2 / Math.sqrt(Math.PI)) * sum;
}

/** erfc x = exp(-x^2)/sqrt(pi) * 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + ...)))) for x >= 2 */
function erfcContinuedFraction(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k < 500; k++) {
    const a = k / 2;
    d = x + a * d;
    d = Math.abs(d) < tiny ? tiny : d;
    c = x + a / c;
    c = Math.abs(c) < tiny ? tiny : c;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / (Math.sqrt(Math.PI) * f);
}
