import { EngineError } from '../core/engine-error';
import { requirePositive } from '../core/validate';

/**
 * A published temperature correlation of a liquid's dynamic viscosity, or one measured value.
 *
 * - `dippr-101`: ln(eta / Pa s) = C1 + C2/T + C3 ln T + C4 T^C5 (DIPPR equation 101, the form of
 *   Perry's Chemical Engineers' Handbook, 8th ed., Table 2-313).
 * - `vogel`: log10(eta / mPa s) = A + B/(C - T) (the three-term Vogel form of Viswanath &
 *   Natarajan, Data Book on the Viscosity of Liquids, 1989).
 * - `single-value`: one viscosity at one temperature, no temperature dependence known.
 *
 * T in K. `minTemperature`/`maxTemperature` are the correlation's stated range of validity.
 */
export type ViscosityCorrelation =
  | {
      form: 'dippr-101';
      coefficients: readonly [number, number, number, number, number];
      minTemperature: number;
      maxTemperature: number;
      source: string;
    }
  | {
      form: 'vogel';
      coefficients: readonly [number, number, number];
      minTemperature: number;
      maxTemperature: number;
      source: string;
    }
  | { form: 'single-value'; viscosity: number; temperature: number; source: string };

export interface ViscosityAtTemperature {
  /** Pa s */
  value: number;
  /** false outside the correlation's range, or away from the one measured temperature */
  withinRange: boolean;
  /** plain words for a person when `withinRange` is false, else null */
  warning: string | null;
}

/** A single value is used as it is within this many kelvin of its own temperature. */
const SINGLE_VALUE_TOLERANCE = 0.5;

/**
 * Dynamic viscosity at temperature T from a correlation, with a warning outside its range
 * of validity (the value is still given: the correlations extrapolate smoothly a little way,
 * and the person decides).
 *
 * @param correlation - a ViscosityCorrelation (see the forms above)
 * @param temperature - K (> 0)
 * @throws EngineError NON_POSITIVE_VALUE / NON_FINITE_VALUE
 * @example viscosityAt({ form: 'vogel', coefficients: [-1.5318, -220.57, 149.39], minTemperature: 270, maxTemperature: 380, source: '' }, 298.15).value // 8.931e-4 (water)
 */
export function viscosityAt(correlation: ViscosityCorrelation, temperature: number): ViscosityAtTemperature {
  requirePositive(temperature, 'temperature');
  if (correlation.form === 'single-value') {
    const near = Math.abs(temperature - correlation.temperature) <= SINGLE_VALUE_TOLERANCE;
    return {
      value: correlation.viscosity,
      withinRange: near,
      warning: near
        ? null
        : `only one viscosity is known (at ${round(correlation.temperature)} K); it is used unchanged at ${round(temperature)} K`,
    };
  }
  const value = correlationValue(correlation, temperature);
  if (!Number.isFinite(value) || value <= 0) {
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'temperature',
      `the viscosity correlation gives no value at ${round(temperature)} K`,
      'Enter the viscosity at this temperature',
    );
  }
  const within = temperature >= correlation.minTemperature && temperature <= correlation.maxTemperature;
  return {
    value,
    withinRange: within,
    warning: within
      ? null
      : `${round(temperature)} K is outside the correlation's range (${round(correlation.minTemperature)}–${round(correlation.maxTemperature)} K); the viscosity is extrapolated`,
  };
}

function correlationValue(
  correlation: Exclude<ViscosityCorrelation, { form: 'single-value' }>,
  temperature: number,
): number {
  if (correlation.form === 'dippr-101') {
    const [c1, c2, c3, c4, c5] = correlation.coefficients;
    const lastTerm = c4 === 0 ? 0 : c4 * temperature ** c5;
    return Math.exp(c1 + c2 / temperature + c3 * Math.log(temperature) + lastTerm);
  }
  const [a, b, c] = correlation.coefficients;
  const millipascalSeconds = 10 ** (a + b / (c - temperature));
  return millipascalSeconds * 1e-3;
}

/** Kelvin as people write them: 298.15, 270, 323.2 (at most two decimals). */
function round(temperature: number): string {
  return String(Math.round(temperature * 100) / 100);
}
