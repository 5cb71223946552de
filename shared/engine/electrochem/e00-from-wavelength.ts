import { PHOTON_ENERGY_EV_NM } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { requireFinite } from '../core/validate';

export const MIN_WAVELENGTH_NM = 200;
export const MAX_WAVELENGTH_NM = 1500;

/**
 * Excited-state energy E00 from a wavelength: E (eV) = hc/(e lambda) = 1239.841984 /
 * lambda (nm), with h, c and e exact in CODATA 2018. Which wavelength stands for E00
 * (emission onset, the absorption/emission crossing, a 77 K maximum) is the user's
 * choice; an emission maximum at room temperature underestimates E00.
 *
 * @param wavelengthNm - wavelength in nm, 200 to 1500
 * @throws EngineError WAVELENGTH_OUT_OF_RANGE outside 200–1500 nm, NON_FINITE_VALUE
 * @example e00FromWavelength(470) // 2.6379...
 */
export function e00FromWavelength(wavelengthNm: number): number {
  requireFinite(wavelengthNm, 'wavelength');
  if (wavelengthNm < MIN_WAVELENGTH_NM || wavelengthNm > MAX_WAVELENGTH_NM) {
    throw new EngineError(
      'WAVELENGTH_OUT_OF_RANGE',
      'wavelength',
      `${wavelengthNm} nm is outside ${MIN_WAVELENGTH_NM}–${MAX_WAVELENGTH_NM} nm`,
      'Enter the wavelength in nanometres',
    );
  }
  return PHOTON_ENERGY_EV_NM / wavelengthNm;
}
