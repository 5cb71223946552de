import { KJ_PER_MOL_PER_EV } from '../engine/core/constants';

/*
 * The one place where Halflight's unit factors live. Stored and computed values are
 * SI-coherent (mol/L, s, L, Pa s, K, V, eV, M^-1 s^-1; shared/engine/README.md); upload
 * parsing, the points grid, the engine's edges, plots and exports convert with the
 * tables and helpers below. Unit keys are ASCII ('uM', 'us', 'uL'); `unitLabel` gives
 * the printed form with the micro sign.
 */

/** mol/L per unit. */
export const CONCENTRATION_UNITS = { M: 1, mM: 1e-3, uM: 1e-6, nM: 1e-9 } as const;
/** s per unit. */
export const TIME_UNITS = { s: 1, ms: 1e-3, us: 1e-6, ns: 1e-9, ps: 1e-12 } as const;
/** L per unit. */
export const VOLUME_UNITS = { L: 1, mL: 1e-3, uL: 1e-6 } as const;
/** Pa s per unit (1 cP = 1 mPa s). */
export const VISCOSITY_UNITS = { 'Pa s': 1, 'mPa s': 1e-3 } as const;

export type ConcentrationUnit = keyof typeof CONCENTRATION_UNITS;
export type TimeUnit = keyof typeof TIME_UNITS;
export type VolumeUnit = keyof typeof VOLUME_UNITS;
export type ViscosityUnit = keyof typeof VISCOSITY_UNITS;
export type Unit = ConcentrationUnit | TimeUnit | VolumeUnit | ViscosityUnit;

export const concentrationUnitKeys = Object.keys(CONCENTRATION_UNITS) as [ConcentrationUnit, ...ConcentrationUnit[]];
export const timeUnitKeys = Object.keys(TIME_UNITS) as [TimeUnit, ...TimeUnit[]];
export const volumeUnitKeys = Object.keys(VOLUME_UNITS) as [VolumeUnit, ...VolumeUnit[]];

const FACTORS: Record<Unit, number> = { ...CONCENTRATION_UNITS, ...TIME_UNITS, ...VOLUME_UNITS, ...VISCOSITY_UNITS };

/** SI value of `value` given in `unit`. @example toSi(2.5, 'mM') // 0.0025 */
export const toSi = (value: number, unit: Unit): number => value * FACTORS[unit];
/** `si` expressed in `unit`. @example fromSi(0.0025, 'mM') // 2.5 */
export const fromSi = (si: number, unit: Unit): number => si / FACTORS[unit];

/** The printed unit: 'uM' -> 'µM', 'us' -> 'µs', 'uL' -> 'µL'. */
export const unitLabel = (unit: Unit): string => unit.replace(/^u/, 'µ');

/** 'µM', 'μM' (Greek mu) and 'uM' are one unit; returns the ASCII key form. */
export const normaliseMicro = (unit: string): string => unit.replace(/^[µμ]/, 'u');

/** The unit key a written unit names ('µM', 'mM', 'ns', ...), or null when it is none of ours. */
export function unitFromText(text: string): Unit | null {
  const key = normaliseMicro(text.trim());
  return key in FACTORS ? (key as Unit) : null;
}
export const isConcentrationUnit = (unit: string): unit is ConcentrationUnit => unit in CONCENTRATION_UNITS;
export const isTimeUnit = (unit: string): unit is TimeUnit => unit in TIME_UNITS;
export const isVolumeUnit = (unit: string): unit is VolumeUnit => unit in VOLUME_UNITS;

/**
 * The concentration unit that shows `largest` (mol/L) as a number from 0.1 to below 100,
 * so a plot axis or a table reads "2.5 mM" rather than "0.0025 M" (common practice).
 * @example concentrationDisplayUnit(0.004) // 'mM'
 */
export function concentrationDisplayUnit(largest: number): ConcentrationUnit {
  const magnitude = Math.abs(largest);
  if (!(magnitude > 0) || magnitude >= 0.1) return 'M';
  if (magnitude >= 1e-4) return 'mM';
  if (magnitude >= 1e-7) return 'uM';
  return 'nM';
}

/** The time unit that shows `largest` (s) as a number from 1 to below 1000. @example timeDisplayUnit(1.1e-6) // 'us' */
export function timeDisplayUnit(largest: number): TimeUnit {
  const magnitude = Math.abs(largest);
  if (!(magnitude > 0) || magnitude >= 1) return 's';
  if (magnitude >= 1e-3) return 'ms';
  if (magnitude >= 1e-6) return 'us';
  return 'ns';
}

/** J/mol per unit (molar energies: activation enthalpies, driving forces). */
export const MOLAR_ENERGY_UNITS = { 'J/mol': 1, 'kJ/mol': 1e3 } as const;

/** Millimolar to mol/L. @example fromMillimolar(2.5) // 0.0025 */
export const fromMillimolar = (value: number): number => toSi(value, 'mM');
/** Micromolar to mol/L. @example fromMicromolar(10) // 1e-5 */
export const fromMicromolar = (value: number): number => toSi(value, 'uM');
/** mol/L to millimolar. @example toMillimolar(0.0025) // 2.5 */
export const toMillimolar = (molar: number): number => fromSi(molar, 'mM');
/** mol/L to micromolar. @example toMicromolar(1e-5) // 10 */
export const toMicromolar = (molar: number): number => fromSi(molar, 'uM');
/** Nanomolar to mol/L. */
export const fromNanomolar = (value: number): number => toSi(value, 'nM');
/** Nanoseconds to seconds. @example fromNanoseconds(1100) // 1.1e-6 */
export const fromNanoseconds = (value: number): number => toSi(value, 'ns');
/** Seconds to microseconds. */
export const toMicroseconds = (seconds: number): number => fromSi(seconds, 'us');
/** Microseconds to seconds. */
export const fromMicroseconds = (value: number): number => toSi(value, 'us');
/** Seconds to nanoseconds. */
export const toNanoseconds = (seconds: number): number => fromSi(seconds, 'ns');
/** Microlitres to litres. @example fromMicrolitres(20) // 2e-5 */
export const fromMicrolitres = (value: number): number => toSi(value, 'uL');
/** Litres to microlitres. */
export const toMicrolitres = (litres: number): number => fromSi(litres, 'uL');
/** Litres to millilitres. */
export const toMillilitres = (litres: number): number => fromSi(litres, 'mL');
/** Millilitres to litres. */
export const fromMillilitres = (value: number): number => toSi(value, 'mL');
/** mPa s (= cP) to Pa s. @example fromMillipascalSeconds(0.89) // 0.00089 */
export const fromMillipascalSeconds = (value: number): number => toSi(value, 'mPa s');
/** Pa s to mPa s (= cP). @example toMillipascalSeconds(0.00089) // 0.89 */
export const toMillipascalSeconds = (pascalSeconds: number): number => fromSi(pascalSeconds, 'mPa s');
/** J/mol to kJ/mol. @example toKilojoulesPerMole(41000) // 41 */
export const toKilojoulesPerMole = (joulesPerMole: number): number => joulesPerMole / MOLAR_ENERGY_UNITS['kJ/mol'];
/** Degrees Celsius to kelvin. @example fromCelsius(25) // 298.15 */
export const fromCelsius = (value: number): number => value + 273.15;
/** Electronvolts (per particle) to kJ/mol, 1 eV = 96.48533212 kJ/mol. */
export const electronvoltsToKilojoulesPerMole = (ev: number): number => ev * KJ_PER_MOL_PER_EV;
/** kJ/mol to electronvolts per particle. */
export const kilojoulesPerMoleToElectronvolts = (kj: number): number => kj / KJ_PER_MOL_PER_EV;
/** Ångström to metres. */
export const fromAngstrom = (value: number): number => value * 1e-10;
