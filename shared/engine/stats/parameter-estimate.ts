import { studentTQuantile975 } from './student-t';

/** A fitted or derived quantity with its standard error and two-sided 95 % interval. */
export interface ParameterEstimate {
  value: number;
  standardError: number;
  /** value -+ t(0.975, df) * standardError */
  interval95: { lower: number; upper: number };
  /** what the standard error includes, in words (set by the study-fit pipeline for the screen and reports) */
  includes?: string;
}

/**
 * Builds a ParameterEstimate with the Student's t interval for `degreesOfFreedom`.
 * Internal helper shared by the fits.
 */
export function makeEstimate(value: number, standardError: number, degreesOfFreedom: number): ParameterEstimate {
  const halfWidth = studentTQuantile975(degreesOfFreedom) * standardError;
  return { value, standardError, interval95: { lower: value - halfWidth, upper: value + halfWidth } };
}
