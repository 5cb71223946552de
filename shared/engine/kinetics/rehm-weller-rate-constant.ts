import { BOLTZMANN_CONSTANT, ELEMENTARY_CHARGE, STANDARD_TEMPERATURE } from '../core/constants';
import { requireFinite, requirePositive } from '../core/validate';

/** Default k_d/(K Z), the value Rehm and Weller used for acetonitrile. */
export const REHM_WELLER_KD_OVER_KZ = 0.25;

/**
 * Natural log of (1 + r [exp(dG‡/kT) + exp(dG/kT)]) and the two exponents, computed
 * without overflow (log-sum-exp). Energies in eV; kT in eV. Shared by model and fit.
 */
export function rehmWellerDenominator(
  drivingForce: number,
  reorganisationEnergy: number,
  kdOverKZ: number,
  thermalEnergy: number,
): { logDenominator: number; activationExponent: number; activation: number } {
  const half = drivingForce / 2;
  const activation = half + Math.sqrt(half * half + (reorganisationEnergy / 4) ** 2);
  const logR = Math.log(kdOverKZ);
  const activationExponent = logR + activation / thermalEnergy;
  const reverseExponent = logR + drivingForce / thermalEnergy;
  const largest = Math.max(0, activationExponent, reverseExponent);
  const logDenominator =
    largest +
    Math.log(Math.exp(-largest) + Math.exp(activationExponent - largest) + Math.exp(reverseExponent - largest));
  return { logDenominator, activationExponent, activation };
}

/**
 * Rehm–Weller correlation of the quenching rate constant with the driving force (Rehm &
 * Weller, Isr. J. Chem. 1970, 8, 259; IUPAC Gold Book RT07472), with the Marcus-type
 * activation term: kq = k_d / (1 + (k_d/(K Z)) [exp(dG‡/RT) + exp(dG/RT)]),
 * dG‡ = dG/2 + sqrt((dG/2)^2 + (lambda/4)^2). Energies per molecule in eV, so RT is
 * written kT/e.
 *
 * @param input.drivingForce - dG_ET in eV (negative = downhill)
 * @param input.reorganisationEnergy - lambda in eV (> 0)
 * @param input.diffusionLimit - k_d in M^-1 s^-1 (> 0)
 * @param input.kdOverKZ - k_d/(K Z), dimensionless (> 0), default 0.25
 * @param input.temperature - K, default 298.15
 * @throws EngineError NON_FINITE_VALUE, NON_POSITIVE_VALUE
 * @example rehmWellerRateConstant({ drivingForce: -1, reorganisationEnergy: 1, diffusionLimit: 2e10 }) // 5.74e9
 */
export function rehmWellerRateConstant(input: {
  drivingForce: number;
  reorganisationEnergy: number;
  diffusionLimit: number;
  kdOverKZ?: number;
  temperature?: number;
}): number {
  const drivingForce = requireFinite(input.drivingForce, 'drivingForce');
  const lambda = requirePositive(input.reorganisationEnergy, 'reorganisationEnergy');
  const kd = requirePositive(input.diffusionLimit, 'diffusionLimit');
  const ratio = requirePositive(input.kdOverKZ ?? REHM_WELLER_KD_OVER_KZ, 'kdOverKZ');
  const temperature = requirePositive(input.temperature ?? STANDARD_TEMPERATURE, 'temperature');
  const thermalEnergy = (BOLTZMANN_CONSTANT * temperature) / ELEMENTARY_CHARGE;
  return kd * Math.exp(-rehmWellerDenominator(drivingForce, lambda, ratio, thermalEnergy).logDenominator);
}
