import { formatNumber, MINUS, powerOfTen, withTrueMinus, writesPlainly } from './format-number';

/** A value and its standard error, rounded together: text parts sharing one power of ten. */
export interface EstimateParts {
  /** the value's mantissa (or the plain value), rounded at the SE's last digit, e.g. '1.07' */
  value: string;
  /** the SE at the same decimal place, e.g. '0.05'; null when no SE is known */
  standardError: string | null;
  /** the shared power of ten (0 when written plainly) */
  exponent: number;
  /** the decimal place of the last digit kept, as a power of ten (e.g. -2 for hundredths of the mantissa) */
  lastDigit: number;
}

const MAX_DECIMALS = 8;
/** An SE below this fraction of the value would need more than six significant figures. */
const FINEST_RELATIVE_SE = 1e-6;
const beyondPrint = (value: number, se: number | null | undefined) =>
  se !== null &&
  se !== undefined &&
  se > 0 &&
  Number.isFinite(value) &&
  value !== 0 &&
  se < Math.abs(value) * FINEST_RELATIVE_SE;

/**
 * The SE rounded to one significant figure, or two when its first digit is 1 (a rounded "1"
 * would throw away too much), and the value rounded at the same decimal place: the convention
 * of J. R. Taylor, An Introduction to Error Analysis, 2nd ed. (1997), section 2.2, rules 2.5
 * and 2.9 (quoted from memory), and common practice in the trade's papers.
 * Returns the power of ten of the SE's last kept digit.
 */
export function uncertaintyDigit(standardError: number): number {
  let order = Math.floor(Math.log10(standardError));
  // log10 can land a hair below an exact power of ten (log10(1000) is fine, 0.1 * 3 is not).
  if (standardError / 10 ** order >= 10) order += 1;
  const leading = Math.floor(standardError / 10 ** order);
  let last = order - (leading === 1 ? 1 : 0);
  const rounded = Math.round(standardError / 10 ** last) * 10 ** last;
  // 0.096 rounds to 0.10: the SE now starts with 1, so keep two figures of the new order.
  if (rounded >= 10 ** (order + 1)) last = order;
  return last;
}

const roundAt = (value: number, last: number) => Math.round(value / 10 ** last) * 10 ** last;
const digitsText = (value: number, last: number) =>
  withTrueMinus(roundAt(value, last).toFixed(Math.min(MAX_DECIMALS, Math.max(0, -last))));

/**
 * Rounds a value and its SE together for print. Values from 0.01 to below 10 000 stay plain
 * ("532 ± 12"); others share the value's power of ten ("(1.07 ± 0.05) × 10⁷").
 * @example estimateParts(1.0712e7, 4.8e5) // { value: '1.07', standardError: '0.05', exponent: 7, lastDigit: -2 }
 */
export function estimateParts(value: number, standardError: number | null | undefined): EstimateParts {
  const se = standardError !== null && standardError !== undefined && standardError > 0 ? standardError : null;
  if (!Number.isFinite(value)) return { value: '—', standardError: null, exponent: 0, lastDigit: 0 };
  if (se === null || !Number.isFinite(se)) {
    // No SE: three significant figures, in the same shape.
    const [mantissa, power] = value.toExponential(2).split('e');
    const exponent = Number(power);
    if (writesPlainly(Math.abs(Number(value.toPrecision(3)))))
      return { value: formatNumber(value, 3), standardError: null, exponent: 0, lastDigit: exponent - 2 };
    return { value: withTrueMinus(mantissa!), standardError: null, exponent, lastDigit: -2 };
  }
  const last = uncertaintyDigit(se);
  const rounded = roundAt(value, last);
  const magnitude = Math.abs(rounded) || roundAt(se, last);
  if (writesPlainly(magnitude) && writesPlainly(roundAt(se, last)))
    return { value: digitsText(value, last), standardError: digitsText(se, last), exponent: 0, lastDigit: last };
  let exponent = Math.floor(Math.log10(magnitude));
  if (magnitude / 10 ** exponent >= 10) exponent += 1;
  const relativeLast = last - exponent;
  return {
    value: digitsText(value / 10 ** exponent, relativeLast),
    standardError: digitsText(se / 10 ** exponent, relativeLast),
    exponent,
    lastDigit: relativeLast,
  };
}

/**
 * A value with its SE and unit, as printed in a paper.
 * @example formatEstimate(1.0712e7, 4.8e5, 'M⁻¹ s⁻¹') // '(1.07 ± 0.05) × 10⁷ M⁻¹ s⁻¹'
 * @example formatEstimate(532.4, 12.3, 'M⁻¹') // '532 ± 12 M⁻¹'
 */
export function formatEstimate(value: number, standardError: number | null | undefined, unit = ''): string {
  // Constructed or exact data: the value to three figures and the tiny SE as it is, never 12 zeros.
  if (beyondPrint(value, standardError))
    return `${formatNumber(value, 3)} ± ${formatNumber(standardError, 2)}${unit ? ` ${unit}` : ''}`;
  const parts = estimateParts(value, standardError);
  const core = parts.standardError === null ? parts.value : `${parts.value} ± ${parts.standardError}`;
  const unitText = unit ? ` ${unit}` : '';
  if (parts.exponent === 0) return `${core}${unitText}`;
  const grouped = parts.standardError === null ? core : `(${core})`;
  return `${grouped}${powerOfTen(parts.exponent)}${unitText}`;
}

/**
 * A 95 % interval at the decimal place of its estimate's SE, sharing the value's power of ten.
 * @example formatInterval(9.7e6, 1.17e7, 4.8e5, 1.0712e7) // '(0.97 to 1.17) × 10⁷'
 */
export function formatInterval(
  lower: number,
  upper: number,
  standardError: number | null | undefined,
  value: number,
  unit = '',
): string {
  if (beyondPrint(value, standardError))
    return `${formatNumber(lower, 6)} to ${formatNumber(upper, 6)}${unit ? ` ${unit}` : ''}`;
  const parts = estimateParts(value, standardError);
  const scale = 10 ** parts.exponent;
  const end = (bound: number) =>
    Number.isFinite(bound) ? digitsText(bound / scale, parts.lastDigit) : bound > 0 ? '∞' : `${MINUS}∞`;
  const core = `${end(lower)} to ${end(upper)}`;
  const unitText = unit ? ` ${unit}` : '';
  return parts.exponent === 0 ? `${core}${unitText}` : `(${core})${powerOfTen(parts.exponent)}${unitText}`;
}
