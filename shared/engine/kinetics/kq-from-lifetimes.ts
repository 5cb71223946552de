import { requireNonNegativeArray, requirePositiveArray, requireSameLength } from '../core/validate';
import { fitLine } from '../stats/fit-line';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';

export interface KqFromLifetimes {
  /** kq in M^-1 s^-1: the slope of 1/tau against [Q] */
  kq: ParameterEstimate;
  /** the intercept 1/tau0 in s^-1 */
  inverseTau0: ParameterEstimate;
  degreesOfFreedom: number;
  n: number;
}

/**
 * Bimolecular quenching rate constant from lifetimes alone: 1/tau = 1/tau0 + kq [Q] (the
 * Stern–Volmer relation tau0/tau = 1 + kq tau0 [Q] divided by tau0; IUPAC Gold Book S06004),
 * a straight line with a free intercept whose slope is kq. tau0 does not enter: it is the
 * intercept, so its uncertainty is not counted once inside the ratios tau0/tau and again when
 * K_SV is divided by tau0. Standard errors as fitLine (s^2 (X^T W X)^-1).
 *
 * @param input.concentrations - [Q] in mol/L (>= 0, at least 2 distinct, 3 points)
 * @param input.lifetimes - tau in s (> 0)
 * @param input.lifetimeUncertainties - optional 1-sigma of each tau, s; weights 1/sigma(1/tau)^2 = tau^4/sigma^2
 * @throws EngineError LENGTH_MISMATCH, NEGATIVE_VALUE, NON_POSITIVE_VALUE, TOO_FEW_POINTS, DEGENERATE_DATA
 * @example kqFromLifetimes({ concentrations: [0, 1e-3, 2e-3], lifetimes: [1e-6, 5e-7, 1e-6 / 3] }).kq.value // 1e9
 */
export function kqFromLifetimes(input: {
  concentrations: readonly number[];
  lifetimes: readonly number[];
  lifetimeUncertainties?: readonly number[];
}): KqFromLifetimes {
  const { concentrations, lifetimes, lifetimeUncertainties } = input;
  requireSameLength(concentrations, lifetimes, 'concentrations', 'lifetimes');
  requireNonNegativeArray(concentrations, 'concentrations');
  requirePositiveArray(lifetimes, 'lifetimes');
  let weights: number[] | undefined;
  if (lifetimeUncertainties) {
    requireSameLength(lifetimes, lifetimeUncertainties, 'lifetimes', 'lifetimeUncertainties');
    requirePositiveArray(lifetimeUncertainties, 'lifetimeUncertainties');
    // sigma(1/tau) = sigma_tau / tau^2 (first-order propagation); same length as lifetimes (checked above).
    weights = lifetimes.map((tau, i) => tau ** 4 / lifetimeUncertainties[i]! ** 2);
  }
  const line = fitLine(
    concentrations,
    lifetimes.map((tau) => 1 / tau),
    weights,
  );
  const df = line.degreesOfFreedom;
  return {
    kq: makeEstimate(line.slope, line.slopeStandardError, df),
    inverseTau0: makeEstimate(line.intercept, line.interceptStandardError, df),
    degreesOfFreedom: df,
    n: line.n,
  };
}
