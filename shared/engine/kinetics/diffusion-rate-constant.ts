import { GAS_CONSTANT, STANDARD_TEMPERATURE } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requirePositive } from '../core/validate';
import { getSolvent } from './solvents';
import { viscosityAt } from './viscosity-correlation';

/**
 * Diffusion-controlled rate constant from the Smoluchowski equation with Stokes–Einstein
 * diffusion coefficients for two spheres of equal radius: k_diff = 8RT / (3 eta). With
 * eta in Pa s this is m^3 mol^-1 s^-1; times 1000 gives M^-1 s^-1.
 *
 * @param viscosity - dynamic viscosity in Pa s (> 0), at the same temperature
 * @param temperature - K (> 0), default 298.15
 * @throws EngineError NON_POSITIVE_VALUE / NON_FINITE_VALUE
 * @example diffusionRateConstant(0.89e-3) // 7.4276e9 (M^-1 s^-1, water at 25 °C)
 */
export function diffusionRateConstant(viscosity: number, temperature: number = STANDARD_TEMPERATURE): number {
  requirePositive(viscosity, 'viscosity');
  requirePositive(temperature, 'temperature');
  return ((8 * GAS_CONSTANT * temperature) / (3 * viscosity)) * 1000;
}

export interface SolventDiffusionLimit {
  /** k_diff, M^-1 s^-1 */
  value: number;
  /** eta(T), Pa s */
  viscosity: number;
  temperature: number;
  /** where eta(T) comes from, for people */
  basis: string;
  /** set when T is outside the correlation's range or only one viscosity is known */
  warning: string | null;
}

/**
 * k_diff = 8RT/(3 eta(T)) for a solvent of the table at temperature T, with eta(T) from the
 * solvent's handbook correlation (Perry 8th ed. Table 2-313 or Viswanath & Natarajan 1989,
 * named per row in SOLVENTS) and a warning outside the correlation's range of validity.
 *
 * @param solvent - SolventId, e.g. 'acetonitrile'
 * @param temperature - K (> 0), default 298.15
 * @throws EngineError UNKNOWN_SOLVENT, MISSING_SOLVENT_DATA (no sourced viscosity, e.g. TFE)
 * @example solventDiffusionLimitAt('acetonitrile', 323.15).value // 2.638e10 (M^-1 s^-1; eta 0.2726 mPa s)
 */
export function solventDiffusionLimitAt(
  solvent: string,
  temperature: number = STANDARD_TEMPERATURE,
): SolventDiffusionLimit {
  const properties = getSolvent(solvent);
  if (properties.viscosityCorrelation === null) {
    throw new EngineError(
      'MISSING_SOLVENT_DATA',
      'solvent',
      `no sourced viscosity for ${properties.name}`,
      'Enter the viscosity at the study temperature',
    );
  }
  const viscosity = viscosityAt(properties.viscosityCorrelation, temperature);
  return {
    value: diffusionRateConstant(viscosity.value, temperature),
    viscosity: viscosity.value,
    temperature,
    basis: `${properties.name} at ${temperature} K (${properties.viscositySource})`,
    warning: viscosity.warning ? `${properties.name}: ${viscosity.warning}` : null,
  };
}

/**
 * The value of solventDiffusionLimitAt alone (M^-1 s^-1).
 *
 * @example solventDiffusionLimit('acetonitrile') // 1.934e10 (M^-1 s^-1, 25 °C)
 */
export function solventDiffusionLimit(solvent: string, temperature: number = STANDARD_TEMPERATURE): number {
  return solventDiffusionLimitAt(solvent, temperature).value;
}
