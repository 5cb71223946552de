import { GAS_CONSTANT, STANDARD_TEMPERATURE } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requirePositive } from '../core/validate';
import { getSolvent } from './solvents';

/**
 * Diffusion-controlled rate constant from the Smoluchowski equation with Stokes–Einstein
 * diffusion coefficients for two spheres of equal radius: k_diff = 8RT / (3 eta). With
 * eta in Pa s this is m^3 mol^-1 s^-1; times 1000 gives M^-1 s^-1.
 *
 * @param viscosity - dynamic viscosity in Pa s (> 0)
 * @param temperature - K (> 0), default 298.15
 * @throws EngineError NON_POSITIVE_VALUE / NON_FINITE_VALUE
 * @example diffusionRateConstant(0.89e-3) // 7.4276e9 (M^-1 s^-1, water at 25 °C)
 */
export function diffusionRateConstant(viscosity: number, temperature: number = STANDARD_TEMPERATURE): number {
  requirePositive(viscosity, 'viscosity');
  requirePositive(temperature, 'temperature');
  return ((8 * GAS_CONSTANT * temperature) / (3 * viscosity)) * 1000;
}

/**
 * k_diff = 8RT/(3 eta) at 25 °C for a solvent of the table (viscosities are 25 °C
 * values, so no other temperature is offered here; use diffusionRateConstant with a
 * measured viscosity instead).
 *
 * @param solvent - SolventId, e.g. 'acetonitrile'
 * @throws EngineError UNKNOWN_SOLVENT, MISSING_SOLVENT_DATA (no sourced viscosity, e.g. TFE)
 * @example solventDiffusionLimit('acetonitrile') // 1.933e10 (M^-1 s^-1)
 */
export function solventDiffusionLimit(solvent: string): number {
  const properties = getSolvent(solvent);
  if (properties.viscosity === null) {
    throw new EngineError(
      'MISSING_SOLVENT_DATA',
      'solvent',
      `no sourced 25 °C viscosity for ${properties.name}`,
      'Enter the viscosity and temperature',
    );
  }
  return diffusionRateConstant(properties.viscosity, STANDARD_TEMPERATURE);
}
