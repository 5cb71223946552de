/**
 * Physical constants, CODATA 2018 (Tiesinga, Mohr, Newell & Taylor, NIST CODATA
 * recommended values, web version 8.1). Since the 2019 SI redefinition h, c, e, k and
 * N_A are exact; the vacuum permittivity is measured.
 */

/** Planck constant h, J s (exact). */
export const PLANCK_CONSTANT = 6.62607015e-34;
/** Speed of light in vacuum c, m s^-1 (exact). */
export const SPEED_OF_LIGHT = 299_792_458;
/** Elementary charge e, C (exact). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
/** Boltzmann constant k, J K^-1 (exact). */
export const BOLTZMANN_CONSTANT = 1.380649e-23;
/** Avogadro constant N_A, mol^-1 (exact). */
export const AVOGADRO_CONSTANT = 6.02214076e23;
/** Molar gas constant R = N_A k, J mol^-1 K^-1 (exact). */
export const GAS_CONSTANT = AVOGADRO_CONSTANT * BOLTZMANN_CONSTANT;
/** Faraday constant F = N_A e, C mol^-1 (exact). */
export const FARADAY_CONSTANT = AVOGADRO_CONSTANT * ELEMENTARY_CHARGE;
/** Vacuum electric permittivity eps0, F m^-1 (CODATA 2018, relative uncertainty 1.5e-10). */
export const VACUUM_PERMITTIVITY = 8.8541878128e-12;

/** hc/e in eV nm: E(eV) = 1239.841984 / lambda(nm). */
export const PHOTON_ENERGY_EV_NM = (PLANCK_CONSTANT * SPEED_OF_LIGHT) / ELEMENTARY_CHARGE / 1e-9;
/** One electronvolt per particle in kJ/mol (e N_A / 1000 = 96.48533212...). */
export const KJ_PER_MOL_PER_EV = FARADAY_CONSTANT / 1000;

/** 25 degrees Celsius in kelvin, the temperature of the handbook tables. */
export const STANDARD_TEMPERATURE = 298.15;
