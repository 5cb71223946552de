import { KJ_PER_MOL_PER_EV } from '../core/constants';
import { requirePositive } from '../core/validate';

export interface EnergyTransferFeasibility {
  /** E_T(acceptor) - E_T(donor), eV; negative means downhill */
  energyDifference: number;
  energyDifferenceKilojoulesPerMole: number;
  /** the quencher's triplet lies below the catalyst's */
  possible: boolean;
}

/**
 * Triplet–triplet energy transfer from an excited catalyst to a quencher is
 * thermodynamically possible when the quencher's triplet energy lies below the
 * catalyst's (Turro, Ramamurthy & Scaiano, Modern Molecular Photochemistry of Organic
 * Molecules, 2010, ch. 7 — citation from memory). Rates fall off steeply once the step is uphill.
 *
 * @param input.catalystTripletEnergy - E_T of the catalyst, eV (> 0)
 * @param input.quencherTripletEnergy - E_T of the quencher, eV (> 0)
 * @throws EngineError NON_POSITIVE_VALUE, NON_FINITE_VALUE
 * @example energyTransferFeasibility({ catalystTripletEnergy: 2.5, quencherTripletEnergy: 2.2 }).possible // true
 */
export function energyTransferFeasibility(input: {
  catalystTripletEnergy: number;
  quencherTripletEnergy: number;
}): EnergyTransferFeasibility {
  const donor = requirePositive(input.catalystTripletEnergy, 'catalystTripletEnergy');
  const acceptor = requirePositive(input.quencherTripletEnergy, 'quencherTripletEnergy');
  const energyDifference = acceptor - donor;
  return {
    energyDifference,
    energyDifferenceKilojoulesPerMole: energyDifference * KJ_PER_MOL_PER_EV,
    possible: energyDifference < 0,
  };
}
