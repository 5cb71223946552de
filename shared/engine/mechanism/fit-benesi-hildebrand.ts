import { EngineError } from '../core/engine-error';
import {
  countDistinct,
  requireFiniteArray,
  requireNonNegative,
  requireNonNegativeArray,
  requireSameLength,
} from '../core/validate';
import { fitLine } from '../stats/fit-line';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';

export interface BenesiHildebrandFit {
  /** M^-1, intercept / slope of the double-reciprocal line */
  kA: ParameterEstimate;
  /** ΔA∞ = 1 / intercept, the change at full complexation (signal unit) */
  limitingChange: ParameterEstimate;
  /** the line 1/ΔA = intercept + slope (1/[Q]) */
  slope: ParameterEstimate;
  intercept: ParameterEstimate;
  rSquared: number;
  /** the transformed points of the plot: x = 1/[Q] (M^-1), y = 1/ΔA */
  points: { x: number; y: number }[];
  degreesOfFreedom: number;
  n: number;
}

/** The double-reciprocal line 1/ΔA against 1/[Q]. */
const lineOf = (q: readonly number[], dA: readonly number[]) =>
  fitLine(
    q.map((value) => 1 / value),
    dA.map((value) => 1 / value),
  );

/**
 * Benesi–Hildebrand double-reciprocal estimate of a 1:1 association constant (Benesi &
 * Hildebrand, J. Am. Chem. Soc. 1949, 71, 2703): with the quencher in large excess,
 * ΔA = ΔA∞ K[Q]/(1 + K[Q]), so 1/ΔA = 1/ΔA∞ + 1/(ΔA∞ K) · 1/[Q] is a straight line whose
 * intercept over slope is K (the original writes [E]0 l/ΔA with Δε; the ratio is the same).
 * Unweighted least squares on the transformed points (fitLine), as the method is usually
 * applied; SE of K by first-order propagation with the line's covariance:
 * (SE_K/K)² = (SE_a/a)² + (SE_b/b)² − 2 cov(a, b)/(ab). The reciprocal gives the points at low
 * [Q] (small ΔA) the largest weight; the isotherm fit (fitBindingIsotherm) does not. Every ΔA is
 * read against the same blank, so the blank's error moves all points together and never shows
 * in the line's residuals: given its SD, it enters by first-order propagation, SE² += (dK/dc σ0)²
 * with dK/dc the change of K when every ΔA shifts by c (central difference).
 *
 * @param concentrations - [Q], mol/L; entries at 0 (the blanks) are skipped; ≥ 3 distinct above 0
 * @param changes - ΔA against the blank, one per concentration, all of one sign where [Q] > 0
 * @param blankStandardError - optional SD of the blank reading every ΔA was taken against (≥ 0)
 * @throws EngineError LENGTH_MISMATCH, TOO_FEW_CONCENTRATIONS, MODEL_NOT_APPLICABLE (a change of 0, mixed
 *   signs, or a line whose intercept and slope differ in sign: no saturation seen)
 * @example fitBenesiHildebrand([0.001, 0.002, 0.004], [0.25 / 3, 0.125, 0.5 / 3]).kA.value // 500 (ΔA∞ = 0.25)
 */
export function fitBenesiHildebrand(
  concentrations: readonly number[],
  changes: readonly number[],
  blankStandardError = 0,
): BenesiHildebrandFit {
  requireSameLength(concentrations, changes, 'concentrations', 'changes');
  requireNonNegativeArray(concentrations, 'concentrations');
  requireFiniteArray(changes, 'changes');
  requireNonNegative(blankStandardError, 'blankStandardError');
  const used = concentrations.flatMap((q, i) => (q > 0 ? [i] : []));
  const q = used.map((i) => concentrations[i]!);
  if (countDistinct(q) < 3)
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      `the double-reciprocal line needs at least 3 different quencher concentrations above 0, got ${countDistinct(q)}`,
      'Record spectra at more quencher concentrations',
    );
  const dA = used.map((i) => changes[i]!);
  if (!(dA.every((value) => value > 0) || dA.every((value) => value < 0)))
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'changes',
      'the change is zero or changes sign along the titration, so 1/ΔA has no straight line',
      'Choose a band where the absorbance changes steadily with the quencher',
    );
  const points = q.map((value, k) => ({ x: 1 / value, y: 1 / dA[k]! }));
  const line = lineOf(q, dA);
  const { intercept: a, slope: b } = line;
  const k = a / b;
  if (!(k > 0) || !Number.isFinite(k))
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'changes',
      'the double-reciprocal line meets the 1/ΔA axis on the wrong side of zero, so it gives no positive association constant',
      'The change shows no saturation over these concentrations; extend the titration',
    );
  let blankPart = 0;
  if (blankStandardError > 0) {
    const h = 1e-4 * Math.min(...dA.map(Math.abs));
    const shifted = (c: number) => {
      const moved = lineOf(
        q,
        dA.map((value) => value + c),
      );
      return moved.intercept / moved.slope;
    };
    blankPart = ((shifted(h) - shifted(-h)) / (2 * h)) * blankStandardError;
  }
  const relative =
    (line.interceptStandardError / a) ** 2 +
    (line.slopeStandardError / b) ** 2 -
    (2 * line.slopeInterceptCovariance) / (a * b);
  const df = line.degreesOfFreedom;
  return {
    kA: makeEstimate(k, Math.hypot(k * Math.sqrt(Math.max(relative, 0)), blankPart), df),
    limitingChange: makeEstimate(1 / a, line.interceptStandardError / (a * a), df),
    slope: makeEstimate(b, line.slopeStandardError, df),
    intercept: makeEstimate(a, line.interceptStandardError, df),
    rSquared: line.rSquared,
    points,
    degreesOfFreedom: df,
    n: line.n,
  };
}
