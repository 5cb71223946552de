import { ELEMENTARY_CHARGE, VACUUM_PERMITTIVITY } from '../core/constants';
import { requireFinite, requirePositive } from '../core/validate';

/** Default encounter distance, 7 Å, in m. */
export const DEFAULT_ENCOUNTER_DISTANCE = 7e-10;

/**
 * Coulomb work term of photoinduced electron transfer, the difference between the
 * product pair and the reactant pair: w = [z(D+) z(A-) - z(D) z(A)] e^2 / (4 pi eps0
 * eps_r a) (IUPAC Gold Book GT07388, "Gibbs energy of photoinduced electron transfer"),
 * returned in eV per pair. For neutral donor and acceptor this is -e^2/(4 pi eps0 eps_r a).
 *
 * @param input.donorCharge - charge number of the donor before transfer (default 0)
 * @param input.acceptorCharge - charge number of the acceptor before transfer (default 0)
 * @param input.permittivity - relative permittivity of the solvent (> 0)
 * @param input.distance - encounter distance a in m (> 0), default 7e-10
 * @throws EngineError NON_POSITIVE_VALUE, NON_FINITE_VALUE
 * @example coulombWorkTerm({ permittivity: 35.69 }) // -0.05764 (eV; neutral pair in acetonitrile at 7 Å)
 */
export function coulombWorkTerm(input: {
  donorCharge?: number;
  acceptorCharge?: number;
  permittivity: number;
  distance?: number;
}): number {
  const zD = requireFinite(input.donorCharge ?? 0, 'donorCharge');
  const zA = requireFinite(input.acceptorCharge ?? 0, 'acceptorCharge');
  const permittivity = requirePositive(input.permittivity, 'permittivity');
  const distance = requirePositive(input.distance ?? DEFAULT_ENCOUNTER_DISTANCE, 'distance');
  const chargeTerm = (zD + 1) * (zA - 1) - zD * zA;
  // e^2/(4 pi eps0 eps_r a) in J, divided by e for eV.
  return (chargeTerm * ELEMENTARY_CHARGE) / (4 * Math.PI * VACUUM_PERMITTIVITY * permittivity * distance);
}
