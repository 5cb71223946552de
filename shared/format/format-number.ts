/*
 * The one way Halflight writes a number for a person: on every screen, in the PNG figures, the
 * PDF reports and the CSV headers. Large and small values are written as a mantissa times a
 * power of ten with real superscript digits (5.00 × 10⁸), negative values with a true minus
 * sign (U+2212), as in typeset papers (common practice).
 */

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
/** True minus sign, U+2212; the hyphen-minus is for typed input and CSV cells. */
export const MINUS = '−';
export const TIMES = '×';

/** An integer in superscript digits. @example superscript(-12) // '⁻¹²' */
export function superscript(exponent: number): string {
  const digits = String(Math.abs(Math.trunc(exponent)))
    .split('')
    .map((digit) => SUPERSCRIPT_DIGITS[Number(digit)])
    .join('');
  return exponent < 0 ? `⁻${digits}` : digits;
}

/** '-1.5' -> '−1.5': the printed sign of a number already rounded to text. */
export const withTrueMinus = (text: string): string => text.replace(/^-/, MINUS);

/** "× 10⁷", the factor after a mantissa; empty for 10⁰. */
export const powerOfTen = (exponent: number): string => (exponent === 0 ? '' : ` ${TIMES} 10${superscript(exponent)}`);

/** Below this magnitude, and from PLAIN_UPPER on, numbers get a power of ten. */
const PLAIN_LOWER = 0.01;
const PLAIN_UPPER = 10_000;

/** Whether a magnitude is written plainly (0, or from 0.01 to below 10 000). */
export const writesPlainly = (magnitude: number): boolean =>
  magnitude === 0 || (magnitude >= PLAIN_LOWER && magnitude < PLAIN_UPPER);

/**
 * A number to `digits` significant figures; from 10 000 up and below 0.01 as mantissa × 10ⁿ.
 * Missing or non-finite values print as an em dash.
 * @example formatNumber(1.0712e7) // '1.07 × 10⁷'
 * @example formatNumber(-2.5e-5, 2) // '−2.5 × 10⁻⁵'
 * @example formatNumber(0.5) // '0.5'
 * @example formatNumber(1.9, 3, { trailingZeros: true }) // '1.90'
 */
export function formatNumber(
  value: number | null | undefined,
  digits = 3,
  options: { trailingZeros?: boolean } = {},
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  if (writesPlainly(Number(magnitude.toPrecision(digits))))
    // Trailing zeros are kept for measured values ("1.90 µs"), dropped for ticks and typed values ("0.5").
    return withTrueMinus(options.trailingZeros ? value.toPrecision(digits) : String(Number(value.toPrecision(digits))));
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
  return `${withTrueMinus(mantissa!)}${powerOfTen(Number(exponent))}`;
}

/**
 * A number with a fixed count of decimals and an explicit sign when `signed` (potentials,
 * energies, driving forces: "+1.21 V", "−0.42 eV").
 * @example formatFixed(-0.4249, 2, { signed: true }) // '−0.42'
 */
export function formatFixed(value: number | null | undefined, decimals: number, options: { signed?: boolean } = {}) {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = Math.abs(value).toFixed(decimals);
  const isZero = Number(text) === 0;
  if (value < 0 && !isZero) return `${MINUS}${text}`;
  return options.signed ? `+${text}` : text;
}

/** A value with its unit, a thin gap between: "1.07 × 10⁷ M⁻¹ s⁻¹"; the dash alone when missing. */
export function formatQuantity(value: number | null | undefined, unit: string, digits = 3): string {
  const number = formatNumber(value, digits);
  return number === '—' || unit === '' ? number : `${number} ${unit}`;
}
