import { seededRandom } from './seeded-random';

/*
 * Synthetic decay histograms for the decay-fit tests, made independently of the engine: each
 * exponential is convolved with a Gaussian instrument response in closed form (the
 * exponentially modified Gaussian density, Grushka, Anal. Chem. 1972, 44, 1733, from memory),
 * integrated over each channel by Simpson's rule, scaled to the wanted peak, with a constant
 * background, then drawn as Poisson counts with a seeded generator.
 */

/** e^(x^2) erfc(x) for x >= 0: Numerical Recipes' erfcc (Press et al., 2nd ed., sect. 6.2), fractional error < 1.2e-7. */
function erfcx(x: number): number {
  const t = 1 / (1 + 0.5 * x);
  const poly =
    -1.26551223 +
    t *
      (1.00002368 +
        t *
          (0.37409196 +
            t *
              (0.09678418 +
                t *
                  (-0.18628806 +
                    t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  return t * Math.exp(poly);
}

/** Standard normal CDF from erfcx, accurate in both tails. */
function normalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const tail = 0.5 * erfcx(x) * Math.exp(-x * x);
  return z < 0 ? tail : 1 - tail;
}

/** Density of a unit-area Gaussian (centre mu, width sigma) convolved with (1/tau) exp(-t/tau). */
function emgDensity(t: number, mu: number, sigma: number, tau: number): number {
  const z = (t - mu) / sigma;
  const w = z - sigma / tau;
  // exp(sigma^2/2tau^2 - (t - mu)/tau) Phi(w) without overflow: for w <= 0 it equals 1/2 e^(-z^2/2) erfcx(-w/sqrt 2)
  const h =
    w <= 0
      ? 0.5 * Math.exp(-0.5 * z * z) * erfcx(-w / Math.SQRT2)
      : Math.exp((sigma * sigma) / (2 * tau * tau) - (t - mu) / tau) * normalCdf(w);
  return h / tau;
}

const gaussianDensity = (t: number, mu: number, sigma: number) =>
  Math.exp(-0.5 * ((t - mu) / sigma) ** 2) / (sigma * Math.sqrt(2 * Math.PI));

/** Integral of f over each channel [i w, (i+1) w) by composite Simpson with 16 panels. */
function perChannel(channels: number, width: number, f: (t: number) => number): Float64Array {
  const panels = 16;
  const h = width / panels;
  const out = new Float64Array(channels);
  for (let i = 0; i < channels; i++) {
    const t0 = i * width;
    let sum = f(t0) + f(t0 + width);
    for (let j = 1; j < panels; j++) sum += (j % 2 === 1 ? 4 : 2) * f(t0 + j * h);
    out[i] = (sum * h) / 3;
  }
  return out;
}

/** ln(k!) by table below 20 and Stirling's series above. */
function logFactorial(k: number): number {
  if (k < 20) {
    let sum = 0;
    for (let i = 2; i <= k; i++) sum += Math.log(i);
    return sum;
  }
  const n = k;
  return (
    n * Math.log(n) - n + 0.5 * Math.log(2 * Math.PI * n) + 1 / (12 * n) - 1 / (360 * n ** 3) + 1 / (1260 * n ** 5)
  );
}

/**
 * Poisson deviates: Knuth's product of uniforms below a mean of 10, Hörmann's transformed
 * rejection PTRS above (Insurance Math. Econom. 1993, 12, 39; constants as in NumPy's
 * random_poisson_ptrs, from memory).
 */
export function seededPoisson(seed: number): (mean: number) => number {
  const uniform = seededRandom(seed);
  return (mean) => {
    if (mean <= 0) return 0;
    if (mean < 10) {
      const limit = Math.exp(-mean);
      let k = 0;
      let product = uniform();
      while (product > limit) {
        k++;
        product *= uniform();
      }
      return k;
    }
    const slam = Math.sqrt(mean);
    const logMean = Math.log(mean);
    const b = 0.931 + 2.53 * slam;
    const a = -0.059 + 0.02483 * b;
    const invAlpha = 1.1239 + 1.1328 / (b - 3.4);
    const vr = 0.9277 - 3.6224 / (b - 2);
    for (;;) {
      const u = uniform() - 0.5;
      const v = uniform();
      const us = 0.5 - Math.abs(u);
      const k = Math.floor(((2 * a) / us + b) * u + mean + 0.43);
      if (us >= 0.07 && v <= vr) return k;
      if (k < 0 || (us < 0.013 && v > us)) continue;
      if (Math.log(v) + Math.log(invAlpha) - Math.log(a / (us * us) + b) <= -mean + k * logMean - logFactorial(k))
        return k;
    }
  };
}

export interface SyntheticDecayOptions {
  channels: number;
  /** s */
  channelWidth: number;
  /** centre of the Gaussian response, s */
  responseCentre: number;
  /** full width at half maximum of the response, s */
  responseFwhm: number;
  /** lifetimes (s) with their fractional amplitudes alpha_i (summing to 1) */
  components: Array<{ lifetime: number; fraction: number }>;
  /** expected counts in the highest channel of the decay (before background) */
  peak?: number;
  /** constant background, counts per channel */
  background?: number;
  /** expected counts in the highest channel of the response */
  responsePeak?: number;
  seed: number;
}

export interface SyntheticDecay {
  counts: number[];
  response: number[];
  /** noise-free expected counts (with background) */
  expected: Float64Array;
}

/** One synthetic decay with its measured (noisy) response; same seed, same counts. */
export function syntheticDecay(options: SyntheticDecayOptions): SyntheticDecay {
  const { channels, channelWidth, responseCentre } = options;
  const sigma = options.responseFwhm / (2 * Math.sqrt(2 * Math.LN2));
  const shape = new Float64Array(channels);
  for (const { lifetime, fraction } of options.components) {
    const part = perChannel(channels, channelWidth, (t) => emgDensity(t, responseCentre, sigma, lifetime));
    // alpha_i exp(-t/tau_i) holds alpha_i tau_i photons
    for (let i = 0; i < channels; i++) shape[i]! += fraction * lifetime * part[i]!;
  }
  const scale = (options.peak ?? 1e4) / Math.max(...shape);
  const background = options.background ?? 3;
  const expected = shape.map((value) => value * scale + background);
  const draw = seededPoisson(options.seed);
  const counts = Array.from(expected, (mean) => draw(mean));
  const pulse = perChannel(channels, channelWidth, (t) => gaussianDensity(t, responseCentre, sigma));
  const pulseScale = (options.responsePeak ?? 1e4) / Math.max(...pulse);
  const responseDraw = seededPoisson(options.seed + 7919);
  const response = Array.from(pulse, (value) => responseDraw(value * pulseScale));
  return { counts, response, expected };
}
