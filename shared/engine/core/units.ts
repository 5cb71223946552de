import { KJ_PER_MOL_PER_EV } from './constants';

/*
 * Unit helpers for the edges of the engine. Inside, concentrations are mol/L, times s,
 * volumes L, viscosities Pa s, potentials V, energies eV, rate constants M^-1 s^-1.
 */

/** Millimolar to mol/L. @example fromMillimolar(2.5) // 0.0025 */
export const fromMillimolar = (value: number): number => value * 1e-3;
/** Micromolar to mol/L. @example fromMicromolar(10) // 1e-5 */
export const fromMicromolar = (value: number): number => value * 1e-6;
/** Nanomolar to mol/L. */
export const fromNanomolar = (value: number): number => value * 1e-9;
/** Nanoseconds to seconds. @example fromNanoseconds(1100) // 1.1e-6 */
export const fromNanoseconds = (value: number): number => value * 1e-9;
/** Microseconds to seconds. */
export const fromMicroseconds = (value: number): number => value * 1e-6;
/** Seconds to nanoseconds. */
export const toNanoseconds = (seconds: number): number => seconds * 1e9;
/** Microlitres to litres. @example fromMicrolitres(20) // 2e-5 */
export const fromMicrolitres = (value: number): number => value * 1e-6;
/** Litres to microlitres. */
export const toMicrolitres = (litres: number): number => litres * 1e6;
/** Millilitres to litres. */
export const fromMillilitres = (value: number): number => value * 1e-3;
/** mPa s (= cP) to Pa s. @example fromMillipascalSeconds(0.89) // 0.00089 */
export const fromMillipascalSeconds = (value: number): number => value * 1e-3;
/** Degrees Celsius to kelvin. @example fromCelsius(25) // 298.15 */
export const fromCelsius = (value: number): number => value + 273.15;
/** Electronvolts (per particle) to kJ/mol, 1 eV = 96.48533212 kJ/mol. */
export const electronvoltsToKilojoulesPerMole = (ev: number): number => ev * KJ_PER_MOL_PER_EV;
/** kJ/mol to electronvolts per particle. */
export const kilojoulesPerMoleToElectronvolts = (kj: number): number => kj / KJ_PER_MOL_PER_EV;
/** Ångström to metres. */
export const fromAngstrom = (value: number): number => value * 1e-10;
