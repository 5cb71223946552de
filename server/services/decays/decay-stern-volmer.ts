import { EngineError, fitLifetimeSternVolmer } from '@shared/engine';
import type { DecayOutcome, DecaySternVolmer } from '@shared/schemas/decays';

type Fitted = DecayOutcome & { lifetime: NonNullable<DecayOutcome['lifetime']>; concentration: number };

/** The decays that carry a lifetime and a concentration, in file order. */
export const fittedWithConcentration = (outcomes: readonly DecayOutcome[]): Fitted[] =>
  outcomes.filter((outcome): outcome is Fitted => outcome.lifetime !== null && outcome.concentration !== null);

/**
 * tau0 from the zero-concentration decays: one decay's lifetime, or the inverse-variance
 * weighted mean of several with its standard error 1/sqrt(sum w) (Bevington & Robinson, Data
 * Reduction and Error Analysis, 3rd ed., 2003, eqs. 4.17 and 4.19, from memory).
 */
export function tau0FromBlanks(outcomes: readonly DecayOutcome[]): { value: number; standardError: number } | null {
  const blanks = fittedWithConcentration(outcomes).filter((outcome) => outcome.concentration === 0);
  if (blanks.length === 0) return null;
  if (blanks.some((blank) => !(blank.lifetime.standardError > 0))) {
    const mean = blanks.reduce((sum, blank) => sum + blank.lifetime.value, 0) / blanks.length;
    return { value: mean, standardError: blanks[0]!.lifetime.standardError };
  }
  const weights = blanks.map((blank) => 1 / blank.lifetime.standardError ** 2);
  const total = weights.reduce((sum, weight) => sum + weight, 0);
  return {
    value: blanks.reduce((sum, blank, i) => sum + weights[i]! * blank.lifetime.value, 0) / total,
    standardError: 1 / Math.sqrt(total),
  };
}

/**
 * The lifetime Stern–Volmer line of a decay set, tau0/tau = 1 + K_SV [Q] (Lakowicz, 3rd ed.,
 * 2006, eq. 8.2), through the engine's fitLifetimeSternVolmer with the decays' standard errors
 * as weights and tau0 from the zero-concentration decays. Null with the reason when it cannot
 * be drawn (fewer than three concentrations, no blank).
 */
export function decaySternVolmer(outcomes: readonly DecayOutcome[]): {
  sternVolmer: DecaySternVolmer | null;
  problem: string | null;
} {
  const fitted = fittedWithConcentration(outcomes);
  const tau0 = tau0FromBlanks(outcomes);
  if (!tau0) return { sternVolmer: null, problem: 'No decay at zero quencher concentration gives tau0.' };
  try {
    const fit = fitLifetimeSternVolmer({
      concentrations: fitted.map((outcome) => outcome.concentration),
      lifetimes: fitted.map((outcome) => outcome.lifetime.value),
      lifetimeUncertainties: fitted.map((outcome) =>
        Math.max(outcome.lifetime.standardError, 1e-6 * outcome.lifetime.value),
      ),
      tau0: tau0.value,
    });
    return {
      sternVolmer: {
        tau0,
        kSv: { value: fit.kSv.value, standardError: fit.kSv.standardError },
        points: fitted.map((outcome) => ({
          concentration: outcome.concentration,
          ratio: tau0.value / outcome.lifetime.value,
          label: outcome.label,
        })),
      },
      problem: null,
    };
  } catch (error) {
    if (error instanceof EngineError) return { sternVolmer: null, problem: error.message };
    throw error;
  }
}
