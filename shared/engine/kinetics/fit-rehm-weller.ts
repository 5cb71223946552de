import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { BOLTZMANN_CONSTANT, ELEMENTARY_CHARGE, STANDARD_TEMPERATURE } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requireFiniteArray, requirePositive, requirePositiveArray, requireSameLength } from '../core/validate';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { studentTQuantile975 } from '../stats/student-t';
import { REHM_WELLER_KD_OVER_KZ, rehmWellerDenominator } from './rehm-weller-rate-constant';

export interface RehmWellerFit {
  /** lambda in eV */
  reorganisationEnergy: ParameterEstimate;
  /** k_d/(K Z): fitted (interval from the log10 scale it was fitted on) or fixed */
  kdOverKZ: (ParameterEstimate & { fixed: false }) | { value: number; fixed: true };
  /** log10(kq observed) - log10(kq model), in input order */
  residuals: number[];
  /** residual SD in log10 units */
  residualStandardDeviation: number;
  degreesOfFreedom: number;
  n: number;
  iterations: number;
}

const LN10 = Math.LN10;
/** The range lambda is searched in, eV: from nearly nothing to beyond any reported for outer-sphere ET (common practice). */
const LAMBDA_RANGE = [0.01, 5] as const;

/**
 * Fits the reorganisation energy lambda (and optionally k_d/(K Z)) of the Rehm–Weller
 * correlation (see rehmWellerRateConstant) to measured kq against dG_ET, by least
 * squares on log10 kq with Levenberg–Marquardt (`ml-levenberg-marquardt`, analytic
 * Jacobian), started from the best lambda of a coarse grid. Standard errors are
 * s^2 (J^T J)^-1 from the Jacobian at the solution, s^2 = SS / (n - p). k_d/(K Z) is
 * fitted as log10 so it stays positive; 0.25 (Rehm & Weller's value) when fixed.
 *
 * A lambda the data do not determine is refused rather than returned: when the best fit lies
 * at the edge of the range searched (0.01 or 5 eV: the least-squares minimum is not inside it,
 * e.g. kq scattered with no fall-off, or all on the diffusion plateau) or when its standard
 * error is as large as the value (100 % or more); either way no number for lambda is meaningful.
 *
 * @param input.drivingForces - dG_ET for each quencher, eV
 * @param input.rateConstants - kq for each quencher, M^-1 s^-1 (> 0)
 * @param input.diffusionLimit - k_d, M^-1 s^-1 (> 0), e.g. solventDiffusionLimit('acetonitrile')
 * @param input.fitKdOverKZ - also fit k_d/(K Z) (needs at least 3 points); default false
 * @param input.kdOverKZ - the fixed value, or the start when fitted; default 0.25
 * @param input.temperature - K, default 298.15
 * @throws EngineError LENGTH_MISMATCH, NON_FINITE_VALUE, NON_POSITIVE_VALUE, TOO_FEW_POINTS, FIT_DID_NOT_CONVERGE,
 *   NOT_DETERMINED (lambda at the edge of the range searched, or its SE as large as the value)
 * @example fitRehmWeller({ drivingForces: [-0.6, -0.3, -0.1, 0.1], rateConstants: [5.30e9, 1.46e9, 1.75e8, 3.60e6], diffusionLimit: 1.93e10 }).reorganisationEnergy.value // ~ 0.80
 */
export function fitRehmWeller(input: {
  drivingForces: readonly number[];
  rateConstants: readonly number[];
  diffusionLimit: number;
  fitKdOverKZ?: boolean;
  kdOverKZ?: number;
  temperature?: number;
}): RehmWellerFit {
  const { drivingForces, rateConstants, fitKdOverKZ = false } = input;
  requireSameLength(drivingForces, rateConstants, 'drivingForces', 'rateConstants');
  requireFiniteArray(drivingForces, 'drivingForces');
  requirePositiveArray(rateConstants, 'rateConstants');
  const kd = requirePositive(input.diffusionLimit, 'diffusionLimit');
  const ratio0 = requirePositive(input.kdOverKZ ?? REHM_WELLER_KD_OVER_KZ, 'kdOverKZ');
  const kT =
    (BOLTZMANN_CONSTANT * requirePositive(input.temperature ?? STANDARD_TEMPERATURE, 'temperature')) /
    ELEMENTARY_CHARGE;
  const p = fitKdOverKZ ? 2 : 1;
  const n = drivingForces.length;
  if (n <= p)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'rateConstants',
      `fitting ${p} parameter(s) needs more than ${p} quenchers, got ${n}`,
    );
  const logKd = Math.log10(kd);
  const y = rateConstants.map((k) => Math.log10(k));
  // params holds p = 1 or 2 values: [lambda] or [lambda, log10 k_d/(K Z)]; params[1] is read only when
  // fitKdOverKZ (p = 2). y has one entry per driving force (checked above).
  const ratioOf = (params: number[]) => (fitKdOverKZ ? 10 ** params[1]! : ratio0);
  const model = (params: number[]) => (dG: number) =>
    logKd - rehmWellerDenominator(dG, params[0]!, ratioOf(params), kT).logDenominator / LN10;
  const jacobian = (params: number[]) => (dG: number) => {
    const lambda = params[0]!;
    const { logDenominator, activationExponent } = rehmWellerDenominator(dG, lambda, ratioOf(params), kT);
    const dActivation = lambda / 16 / Math.sqrt((dG / 2) ** 2 + (lambda / 4) ** 2);
    const dLambda = (-Math.exp(activationExponent - logDenominator) * dActivation) / kT / LN10;
    return fitKdOverKZ ? [dLambda, -(1 - Math.exp(-logDenominator))] : [dLambda];
  };
  const sumOfSquares = (params: number[]) => {
    const f = model(params);
    return drivingForces.reduce((sum, dG, i) => sum + (y[i]! - f(dG)) ** 2, 0);
  };
  // Coarse grid for the start: the fit surface in lambda is smooth but flat far out.
  let start = 1;
  let best = Infinity;
  for (let lambda = 0.1; lambda <= 3.0001; lambda += 0.05) {
    const ss = sumOfSquares(fitKdOverKZ ? [lambda, Math.log10(ratio0)] : [lambda]);
    if (ss < best) [best, start] = [ss, lambda];
  }
  const initialValues = fitKdOverKZ ? [start, Math.log10(ratio0)] : [start];
  const result = levenbergMarquardt({ x: drivingForces, y }, model, {
    initialValues,
    jacobianFunction: jacobian,
    minValues: fitKdOverKZ ? [LAMBDA_RANGE[0], -8] : [LAMBDA_RANGE[0]],
    maxValues: fitKdOverKZ ? [LAMBDA_RANGE[1], 8] : [LAMBDA_RANGE[1]],
    maxIterations: 300,
    errorTolerance: 1e-14,
  });
  const params = result.parameterValues;
  if (!params.every(Number.isFinite)) {
    throw new EngineError(
      'FIT_DID_NOT_CONVERGE',
      'rateConstants',
      'the reorganisation-energy fit did not converge',
      'Check the driving forces and rate constants',
    );
  }
  const edge = LAMBDA_RANGE.find((bound) => Math.abs(params[0]! - bound) <= bound * 1e-6);
  if (edge !== undefined)
    throw new EngineError(
      'NOT_DETERMINED',
      'rateConstants',
      `λ is not determined by these rate constants: the best fit lies at the edge of the range searched (${edge} eV)`,
      'Add quenchers near thermoneutral (ΔG from about −0.3 to +0.3 eV), where kq depends most on λ',
    );
  const f = model(params);
  const residuals = drivingForces.map((dG, i) => y[i]! - f(dG));
  const ss = residuals.reduce((sum, r) => sum + r * r, 0);
  const df = n - p;
  const variance = ss / df;
  const covariance = inverseNormalMatrix(
    drivingForces.map((dG) => jacobian(params)(dG)),
    p,
  ).map((row) => row.map((v) => v * variance));
  // covariance is p x p (inverseNormalMatrix), params has p entries.
  const reorganisationEnergy = makeEstimate(params[0]!, Math.sqrt(covariance[0]![0]!), df);
  if (!(reorganisationEnergy.standardError < reorganisationEnergy.value))
    throw new EngineError(
      'NOT_DETERMINED',
      'rateConstants',
      'λ is not determined by these rate constants: its standard error is as large as the value',
      'Add quenchers near thermoneutral (ΔG from about −0.3 to +0.3 eV), where kq depends most on λ',
    );
  let kdOverKZ: RehmWellerFit['kdOverKZ'] = { value: ratio0, fixed: true };
  if (fitKdOverKZ) {
    const logValue = params[1]!;
    const logError = Math.sqrt(covariance[1]![1]!);
    const halfWidth = studentTQuantile975(df) * logError;
    const value = 10 ** logValue;
    kdOverKZ = {
      value,
      standardError: value * LN10 * logError,
      interval95: { lower: 10 ** (logValue - halfWidth), upper: 10 ** (logValue + halfWidth) },
      fixed: false,
    };
  }
  return {
    reorganisationEnergy,
    kdOverKZ,
    residuals,
    residualStandardDeviation: Math.sqrt(variance),
    degreesOfFreedom: df,
    n,
    iterations: result.iterations,
  };
}

/** (J^T J)^-1 for one or two parameters. */
function inverseNormalMatrix(rows: number[][], p: number): number[][] {
  const a: [number, number, number] = [0, 0, 0];
  // Each Jacobian row has p entries; row[1] is read only when p = 2.
  for (const row of rows) {
    a[0] += row[0]! * row[0]!;
    if (p === 2) {
      a[1] += row[0]! * row[1]!;
      a[2] += row[1]! * row[1]!;
    }
  }
  if (p === 1) {
    if (!(a[0] > 0))
      throw new EngineError(
        'DEGENERATE_DATA',
        'drivingForces',
        'the data do not depend on the reorganisation energy here',
        'Include quenchers closer to thermoneutral',
      );
    return [[1 / a[0]]];
  }
  const determinant = a[0] * a[2] - a[1] * a[1];
  if (!(determinant > 0))
    throw new EngineError(
      'DEGENERATE_DATA',
      'drivingForces',
      'lambda and k_d/(K Z) cannot be told apart with these quenchers',
      'Fix k_d/(K Z) or add quenchers over a wider range of driving force',
    );
  return [
    [a[2] / determinant, -a[1] / determinant],
    [-a[1] / determinant, a[0] / determinant],
  ];
}
