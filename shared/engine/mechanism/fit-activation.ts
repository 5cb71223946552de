import { BOLTZMANN_CONSTANT, GAS_CONSTANT, PLANCK_CONSTANT } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requirePositiveArray, requireSameLength } from '../core/validate';
import { fitLine } from '../stats/fit-line';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';

export interface ActivationFit {
  /** Arrhenius: ln k = ln A - Ea/(RT). Ea in J mol^-1 */
  activationEnergy: ParameterEstimate;
  /** ln(A / M^-1 s^-1) */
  lnPreExponentialFactor: ParameterEstimate;
  /** Eyring: ln(k h / (kB T)) = dS/R - dH/(RT). J mol^-1 */
  activationEnthalpy: ParameterEstimate;
  /** J mol^-1 K^-1, for the 1 M standard state of a second-order k in M^-1 s^-1 */
  activationEntropy: ParameterEstimate;
  n: number;
  degreesOfFreedom: number;
}

/**
 * Arrhenius and Eyring fits of a rate constant measured at several temperatures, each an
 * unweighted straight line against 1/T with standard errors from the residuals (n - 2
 * degrees of freedom):
 * - Arrhenius (1889): ln k = ln A - Ea/(RT), so Ea = -R * slope;
 * - Eyring (J. Chem. Phys. 1935, 3, 107) transition-state form, transmission coefficient 1:
 *   ln(k h/(kB T)) = dS‡/R - dH‡/(RT), so dH‡ = -R * slope and dS‡ = R * intercept.
 * For a bimolecular kq in M^-1 s^-1 the entropy refers to the 1 M standard state.
 *
 * @param temperatures - K (> 0), at least 3 distinct
 * @param rateConstants - k at each temperature (> 0), e.g. kq in M^-1 s^-1
 * @throws EngineError TOO_FEW_POINTS (fewer than 3 temperatures), LENGTH_MISMATCH, NON_POSITIVE_VALUE
 * @example fitActivation([280, 300, 320], [1e9, 2e9, 3.5e9]).activationEnergy.value // ~2.09e4 (J/mol)
 */
export function fitActivation(temperatures: readonly number[], rateConstants: readonly number[]): ActivationFit {
  requireSameLength(temperatures, rateConstants, 'temperatures', 'rateConstants');
  requirePositiveArray(temperatures, 'temperatures');
  requirePositiveArray(rateConstants, 'rateConstants');
  if (new Set(temperatures).size < 3) {
    throw new EngineError(
      'TOO_FEW_POINTS',
      'temperatures',
      `activation parameters need at least 3 distinct temperatures, got ${new Set(temperatures).size}`,
      'Add a study at another temperature',
    );
  }
  const inverseT = temperatures.map((t) => 1 / t);
  const arrhenius = fitLine(
    inverseT,
    rateConstants.map((k) => Math.log(k)),
  );
  const eyring = fitLine(
    inverseT,
    rateConstants.map((k, i) => Math.log((k * PLANCK_CONSTANT) / (BOLTZMANN_CONSTANT * temperatures[i]!))),
  );
  const df = arrhenius.degreesOfFreedom;
  const R = GAS_CONSTANT;
  return {
    activationEnergy: makeEstimate(-R * arrhenius.slope, R * arrhenius.slopeStandardError, df),
    lnPreExponentialFactor: makeEstimate(arrhenius.intercept, arrhenius.interceptStandardError, df),
    activationEnthalpy: makeEstimate(-R * eyring.slope, R * eyring.slopeStandardError, df),
    activationEntropy: makeEstimate(R * eyring.intercept, R * eyring.interceptStandardError, df),
    n: arrhenius.n,
    degreesOfFreedom: df,
  };
}
