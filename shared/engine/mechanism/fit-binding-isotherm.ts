import { EngineError } from '../core/engine-error';
import {
  countDistinct,
  requireFiniteArray,
  requireNonNegativeArray,
  requirePositive,
  requireSameLength,
} from '../core/validate';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { solveLeastSquares } from '../stats/solve-least-squares';

export interface BindingIsothermFit {
  /** 'exact' with the emitter's total concentration given, else 'excess' ([Q] ≫ [E]0) */
  form: 'exact' | 'excess';
  /** M^-1 */
  kA: ParameterEstimate;
  /** the signal with no quencher (fitted, so the blank's own noise is not taken as exact) */
  baseline: ParameterEstimate;
  /** the change at full complexation, in the signal's unit (ΔA∞ = Δε l [E]0 for absorbance) */
  limitingChange: ParameterEstimate;
  /** fitted signal at each concentration, in input order */
  fitted: number[];
  residuals: number[];
  residualSumOfSquares: number;
  residualStandardDeviation: number;
  degreesOfFreedom: number;
  n: number;
}

/** ln K is searched from 0.01/[Q]max (barely any complex) to 1e4/[Q]min (all but saturated); our bounds. */
const SEARCH_LOW = 0.01;
const SEARCH_HIGH = 1e4;
const GRID = 240;

/** Fraction of the emitter bound, [EQ]/[E]0, and its derivative in K. */
function boundFraction(q: number, k: number, emitter: number | undefined): { theta: number; dTheta: number } {
  if (q === 0) return { theta: 0, dTheta: 0 };
  if (emitter === undefined) return { theta: (k * q) / (1 + k * q), dTheta: q / (1 + k * q) ** 2 };
  // [EQ] = 2 E Q / (s + √D), s = E + Q + 1/K, D = s² − 4EQ: the root of the quadratic written so it does not cancel.
  const s = emitter + q + 1 / k;
  const root = Math.sqrt(Math.max(s * s - 4 * emitter * q, 0));
  const theta = (2 * q) / (s + root);
  // dθ/dK = (dθ/ds)(ds/dK) with θ = (s − √D)/(2E): dθ/ds = (1 − s/√D)/(2E), ds/dK = −1/K².
  const dTheta = root > 0 ? (s / root - 1) / (2 * emitter * k * k) : 0;
  return { theta, dTheta };
}

/**
 * 1:1 association E + Q ⇌ EQ, K_a = [EQ]/([E][Q]), fitted to a signal that changes in
 * proportion to the complex: y = y0 + Δy∞ [EQ]/[E]0 by nonlinear least squares. With the
 * emitter's total concentration [E]0 the exact root of the mass balance is used,
 * [EQ] = ½{[E]0 + [Q]0 + 1/K − √(([E]0 + [Q]0 + 1/K)² − 4[E]0[Q]0)}, so [Q]0 need not be in
 * large excess; without it the excess form [EQ]/[E]0 = K[Q]/(1 + K[Q]) (Thordarson, Chem. Soc.
 * Rev. 2011, 40, 1305, the 1:1 UV-vis case; equations quoted from memory). For each K the two
 * linear parameters are solved exactly (variable projection: Golub & Pereyra, SIAM J. Numer.
 * Anal. 1973, 10, 413); ln K is found on a grid and refined by golden-section search. SEs from
 * the Jacobian at the optimum, s²(JᵀJ)⁻¹ with s² = SS_res/(n − 3).
 *
 * @param input.concentrations - [Q]0, mol/L, ≥ 0, at least 3 distinct positive values and n ≥ 4
 * @param input.signals - one per concentration (absorbance or any signal linear in [EQ])
 * @param input.emitterConcentration - optional [E]0, mol/L, > 0
 * @throws EngineError LENGTH_MISMATCH, TOO_FEW_CONCENTRATIONS, MODEL_NOT_APPLICABLE (K at the edge of
 *   the search: the change is linear in [Q] or complete at the first concentration), NON_FINITE_VALUE
 * @example fitBindingIsotherm({ concentrations: [0, 1e-3, 2e-3, 4e-3, 8e-3], signals: [0, 0.25 / 3, 0.125, 0.5 / 3, 0.2] }).kA.value // ≈ 500
 */
export function fitBindingIsotherm(input: {
  concentrations: readonly number[];
  signals: readonly number[];
  emitterConcentration?: number;
}): BindingIsothermFit {
  const { concentrations, signals, emitterConcentration: emitter } = input;
  requireSameLength(concentrations, signals, 'concentrations', 'signals');
  requireNonNegativeArray(concentrations, 'concentrations');
  requireFiniteArray(signals, 'signals');
  if (emitter !== undefined) requirePositive(emitter, 'emitterConcentration');
  const positive = concentrations.filter((q) => q > 0);
  if (countDistinct(positive) < 3 || concentrations.length < 4)
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      `a 1:1 isotherm needs at least 3 different quencher concentrations above 0 and 4 spectra, got ${countDistinct(positive)} and ${concentrations.length}`,
      'Record spectra at more quencher concentrations',
    );
  const ones = concentrations.map(() => 1);
  const profile = (k: number) => {
    const theta = concentrations.map((q) => boundFraction(q, k, emitter).theta);
    const solution = solveLeastSquares([ones, theta], signals);
    return { k, theta, solution, rss: solution.residualSumOfSquares };
  };
  const low = Math.log(SEARCH_LOW / Math.max(...positive));
  const high = Math.log(SEARCH_HIGH / Math.min(...positive));
  const step = (high - low) / GRID;
  let best = 0;
  let bestRss = Infinity;
  for (let i = 0; i <= GRID; i++) {
    const rss = profile(Math.exp(low + i * step)).rss;
    if (rss < bestRss) [best, bestRss] = [i, rss];
  }
  if (best === 0 || best === GRID)
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'signals',
      best === 0
        ? 'the change grows in proportion to [Q] up to the highest concentration, so no association constant shows'
        : 'the change is complete at the lowest concentration, so the association constant is too large to measure here',
      best === 0
        ? 'Extend the titration to higher quencher concentrations'
        : 'Add spectra at lower quencher concentrations',
    );
  // Golden-section search on ln K between the grid neighbours of the best point.
  const golden = (Math.sqrt(5) - 1) / 2;
  let a = low + (best - 1) * step;
  let b = low + (best + 1) * step;
  let c = b - golden * (b - a);
  let d = a + golden * (b - a);
  let fc = profile(Math.exp(c)).rss;
  let fd = profile(Math.exp(d)).rss;
  for (let iteration = 0; iteration < 100 && b - a > 1e-10; iteration++) {
    if (fc < fd) {
      [b, d, fd] = [d, c, fc];
      c = b - golden * (b - a);
      fc = profile(Math.exp(c)).rss;
    } else {
      [a, c, fc] = [c, d, fd];
      d = a + golden * (b - a);
      fd = profile(Math.exp(d)).rss;
    }
  }
  const optimum = profile(Math.exp((a + b) / 2));
  const k = optimum.k;
  const [y0, change] = optimum.solution.coefficients as [number, number];
  const derivative = concentrations.map((q) => change * boundFraction(q, k, emitter).dTheta);
  const fitted = optimum.theta.map((theta) => y0 + change * theta);
  const residuals = signals.map((y, i) => y - fitted[i]!);
  const n = signals.length;
  const degreesOfFreedom = n - 3;
  const variance = optimum.rss / degreesOfFreedom;
  // (JᵀJ)⁻¹ of the Jacobian [1, θ, Δy∞ ∂θ/∂K] at the optimum (its QR solve: the design is never squared).
  const covariance = solveLeastSquares([ones, optimum.theta, derivative], residuals).unscaledCovariance;
  const se = (i: number) => Math.sqrt(Math.max(variance * covariance[i]![i]!, 0));
  return {
    form: emitter === undefined ? 'excess' : 'exact',
    kA: makeEstimate(k, se(2), degreesOfFreedom),
    baseline: makeEstimate(y0, se(0), degreesOfFreedom),
    limitingChange: makeEstimate(change, se(1), degreesOfFreedom),
    fitted,
    residuals,
    residualSumOfSquares: optimum.rss,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom,
    n,
  };
}
