import { KJ_PER_MOL_PER_EV } from '../core/constants';
import { requireFinite, requirePositive } from '../core/validate';

export interface DrivingForce {
  /** dG_ET in eV per electron transferred, work term included */
  electronvolts: number;
  /** the same in kJ/mol (1 eV = 96.48533212 kJ/mol) */
  kilojoulesPerMole: number;
  /** the Coulomb work term that is included, eV (0 when not used) */
  workTerm: number;
}

/**
 * Gibbs energy of photoinduced electron transfer, the Rehm–Weller estimate
 * (Rehm & Weller, Isr. J. Chem. 1970, 8, 259; IUPAC Gold Book GT07388):
 * dG_ET = e[E(D+/D) - E(A/A-)] - E00 + w. With potentials in V against one reference in
 * one solvent, e times a potential is simply that number in eV.
 *
 * @param input.donorOxidation - E(D+/D), V
 * @param input.acceptorReduction - E(A/A-), V (same reference)
 * @param input.e00 - energy of the excited partner, eV (> 0)
 * @param input.workTerm - Coulomb term w in eV (see coulombWorkTerm), default 0
 * @throws EngineError NON_FINITE_VALUE, NON_POSITIVE_VALUE
 * @example electronTransferDrivingForce({ donorOxidation: 1.29, acceptorReduction: -0.74, e00: 2.10 }).electronvolts // -0.07
 */
export function electronTransferDrivingForce(input: {
  donorOxidation: number;
  acceptorReduction: number;
  e00: number;
  workTerm?: number;
}): DrivingForce {
  const donor = requireFinite(input.donorOxidation, 'donorOxidation');
  const acceptor = requireFinite(input.acceptorReduction, 'acceptorReduction');
  const e00 = requirePositive(input.e00, 'e00');
  const workTerm = requireFinite(input.workTerm ?? 0, 'workTerm');
  const electronvolts = donor - acceptor - e00 + workTerm;
  return { electronvolts, kilojoulesPerMole: electronvolts * KJ_PER_MOL_PER_EV, workTerm };
}
