import { requirePositiveArray, requireSameLength } from '../core/validate';
import type { InterceptMode } from './diagnose-curvature';
import { fitSternVolmer, type SternVolmerFit } from './fit-stern-volmer';
import { referenceFromBlanks, withReferenceUncertainty, type ReferenceValue } from './reference-from-blanks';

export interface LifetimeSternVolmerFit extends SternVolmerFit {
  /** unquenched lifetime tau0 in s */
  tau0: ReferenceValue;
}

/**
 * Stern–Volmer fit of excited-state lifetimes: tau0/tau = 1 + kq tau0 [Q] (IUPAC Gold
 * Book S06004). The slope K_SV here is purely dynamic; kq follows from
 * quenchingRateConstant(K_SV, tau0). Lifetime uncertainties sigma_tau become ratio
 * uncertainties (tau0/tau) sigma_tau / tau.
 *
 * @param input.concentrations - [Q] in mol/L (>= 0)
 * @param input.lifetimes - lifetimes in s (> 0)
 * @param input.lifetimeUncertainties - optional 1-sigma of each lifetime, s
 * @param input.tau0 - optional unquenched lifetime in s; wins over zero-concentration points
 * @param input.intercept - 'free' (default) or 'fixed-at-one'
 * @throws EngineError NON_POSITIVE_VALUE, MISSING_TAU0, TOO_FEW_CONCENTRATIONS, and those of fitSternVolmer
 * @example fitLifetimeSternVolmer({ concentrations: [0, 1e-3, 2e-3, 3e-3], lifetimes: [1e-6, 5e-7, 3.333333e-7, 2.5e-7] }).kSv.value // ~1000
 */
export function fitLifetimeSternVolmer(input: {
  concentrations: readonly number[];
  lifetimes: readonly number[];
  lifetimeUncertainties?: readonly number[];
  tau0?: number;
  intercept?: InterceptMode;
}): LifetimeSternVolmerFit {
  const { concentrations, lifetimes, lifetimeUncertainties, intercept } = input;
  requireSameLength(concentrations, lifetimes, 'concentrations', 'lifetimes');
  requirePositiveArray(lifetimes, 'lifetimes');
  const tau0 = referenceFromBlanks(concentrations, lifetimes, input.tau0, { field: 'tau0', code: 'MISSING_TAU0' });
  const ratios = lifetimes.map((lifetime) => tau0.value / lifetime);
  let ratioUncertainties: number[] | undefined;
  if (lifetimeUncertainties) {
    requireSameLength(lifetimes, lifetimeUncertainties, 'lifetimes', 'lifetimeUncertainties');
    // Same length as lifetimes (checked just above), and ratios is lifetimes mapped: index i exists.
    ratioUncertainties = lifetimeUncertainties.map((sigma, i) => (ratios[i]! * sigma) / lifetimes[i]!);
  }
  const fit = fitSternVolmer({
    concentrations,
    ratios,
    ...(ratioUncertainties ? { ratioUncertainties } : {}),
    ...(intercept ? { intercept } : {}),
  });
  return { ...withReferenceUncertainty(fit, tau0, ratioUncertainties), tau0 };
}
