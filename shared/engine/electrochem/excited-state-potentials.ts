import { EngineError } from '../core/engine-error';
import { requireFinite, requirePositive } from '../core/validate';

export interface ExcitedStatePotentials {
  /** E*(PC+/PC*) = E(PC+/PC) - E00, V; null without the ground-state oxidation */
  excitedOxidation: number | null;
  /** E*(PC* / PC-) = E(PC/PC-) + E00, V; null without the ground-state reduction */
  excitedReduction: number | null;
}

/**
 * Excited-state redox potentials from ground-state potentials and the excited-state
 * energy: E*(PC+/PC*) = E(PC+/PC) - E00 and E*(PC* / PC-) = E(PC/PC-) + E00 (E00 in eV
 * equals volts per electron), e.g. Prier, Rankic & MacMillan, Chem. Rev. 2013, 113,
 * 5322. Potentials keep whatever reference they were given in.
 *
 * @param input.oxidation - E(PC+/PC) in V, optional
 * @param input.reduction - E(PC/PC-) in V, optional
 * @param input.e00 - excited-state energy in eV (> 0)
 * @throws EngineError MISSING_POTENTIAL when neither potential is given; NON_FINITE_VALUE, NON_POSITIVE_VALUE
 * @example excitedStatePotentials({ oxidation: 1.52, reduction: -1.21, e00: 2.56 }) // { excitedOxidation: -1.04, excitedReduction: 1.35 }
 */
export function excitedStatePotentials(input: {
  oxidation?: number;
  reduction?: number;
  e00: number;
}): ExcitedStatePotentials {
  const e00 = requirePositive(input.e00, 'e00');
  if (input.oxidation === undefined && input.reduction === undefined) {
    throw new EngineError(
      'MISSING_POTENTIAL',
      'oxidation',
      'neither a ground-state oxidation nor a reduction potential was given',
    );
  }
  return {
    excitedOxidation: input.oxidation === undefined ? null : requireFinite(input.oxidation, 'oxidation') - e00,
    excitedReduction: input.reduction === undefined ? null : requireFinite(input.reduction, 'reduction') + e00,
  };
}
