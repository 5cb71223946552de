import { describe, expect, it } from 'vitest';
import {
  estimateParts,
  formatEstimate,
  formatFixed,
  formatInterval,
  formatNumber,
  formatQuantity,
  superscript,
  UNITS,
} from '@shared/format';

// Expected strings are written by hand from the conventions they check: powers of ten as
// "× 10ⁿ" with superscript digits and a true minus (U+2212), as typeset in journals (common
// practice); the rounding of a value to its standard error follows J. R. Taylor, An
// Introduction to Error Analysis, 2nd ed. (1997), section 2.2 (one significant figure in the
// SE, two when it starts with 1; the value to the same decimal place), quoted from memory.

describe('superscript', () => {
  it('when given an exponent, then every digit and the sign become superscript characters', () => {
    expect(superscript(7)).toBe('⁷');
    expect(superscript(10)).toBe('¹⁰');
    expect(superscript(-5)).toBe('⁻⁵');
    expect(superscript(-12)).toBe('⁻¹²');
    expect(superscript(0)).toBe('⁰');
  });
});

describe('formatNumber', () => {
  it('when a value is large, then it is written as mantissa × 10ⁿ with real superscripts', () => {
    expect(formatNumber(1.0712e7)).toBe('1.07 × 10⁷');
    expect(formatNumber(2.63e8)).toBe('2.63 × 10⁸');
    expect(formatNumber(1.933e10, 4)).toBe('1.933 × 10¹⁰');
    expect(formatNumber(10_000)).toBe('1.00 × 10⁴');
    expect(formatNumber(5e8)).toBe('5.00 × 10⁸');
    expect(formatNumber(1.234e10, 2)).toBe('1.2 × 10¹⁰');
  });

  it('when a value is small, then the exponent is negative and written with a superscript minus', () => {
    expect(formatNumber(2.5e-5, 2)).toBe('2.5 × 10⁻⁵');
    expect(formatNumber(8.1e-9)).toBe('8.10 × 10⁻⁹');
  });

  it('when a value is negative, then it gets a true minus sign, not a hyphen', () => {
    expect(formatNumber(-2.5e-5, 2)).toBe('−2.5 × 10⁻⁵');
    expect(formatNumber(-42.25, 4)).toBe('−42.25');
    expect(formatNumber(-2.5e-5)).toBe('−2.50 × 10⁻⁵');
  });

  it('when a value lies from 0.01 to below 10 000, then it is written plainly to the significant figures asked', () => {
    expect(formatNumber(1234.5678)).toBe('1230');
    expect(formatNumber(0.0123456)).toBe('0.0123');
    expect(formatNumber(0.5)).toBe('0.5');
    expect(formatNumber(1.9, 3, { trailingZeros: true })).toBe('1.90');
    expect(formatNumber(0)).toBe('0');
  });

  it('when rounding carries a value past 10 000, then it switches to a power of ten', () => {
    expect(formatNumber(9999.7)).toBe('1.00 × 10⁴');
  });

  it('when there is no finite value, then a dash stands in its place', () => {
    expect([null, undefined, Number.NaN, Number.POSITIVE_INFINITY].map((value) => formatNumber(value))).toEqual([
      '—',
      '—',
      '—',
      '—',
    ]);
  });
});

describe('formatFixed and formatQuantity', () => {
  it('when a potential or driving force is printed, then it has a fixed count of decimals and its sign', () => {
    expect(formatFixed(-0.4249, 2, { signed: true })).toBe('−0.42');
    expect(formatFixed(1.214, 2, { signed: true })).toBe('+1.21');
    expect(formatFixed(-0.001, 2)).toBe('0.00');
  });

  it('when a quantity is printed, then its unit follows with real superscripts', () => {
    expect(formatQuantity(1.0712e7, UNITS.perMolarPerSecond)).toBe('1.07 × 10⁷ M⁻¹ s⁻¹');
    expect(formatQuantity(null, UNITS.perMolar)).toBe('—');
    expect(UNITS.microsecond).toBe('µs');
  });
});

describe('formatEstimate: a value rounded to its standard error', () => {
  it('when the SE starts with 2 to 9, then it keeps one significant figure and the value stops at the same place', () => {
    // 1.0712e7 ± 4.8e5: SE rounds to 5e5, the value to 1.07e7.
    expect(formatEstimate(1.0712e7, 4.8e5, UNITS.perMolarPerSecond)).toBe('(1.07 ± 0.05) × 10⁷ M⁻¹ s⁻¹');
    expect(formatEstimate(92.81, 3.4)).toBe('93 ± 3');
  });

  it('when the SE starts with 1, then it keeps two significant figures', () => {
    expect(formatEstimate(532.4, 12.3, UNITS.perMolar)).toBe('532 ± 12 M⁻¹');
    expect(formatEstimate(2.6345e8, 1.42e7)).toBe('(2.63 ± 0.14) × 10⁸');
  });

  it('when rounding the SE gives a new leading 1, then two figures of the new order are kept', () => {
    // 0.096 rounds to 0.10, and the value to hundredths.
    expect(formatEstimate(1.2345, 0.096)).toBe('1.23 ± 0.10');
  });

  it('when the value is small, then value and SE share one negative power of ten', () => {
    expect(formatEstimate(6.234e-7, 2.1e-8, UNITS.second)).toBe('(6.2 ± 0.2) × 10⁻⁷ s');
    expect(formatEstimate(6.234e-7, 1.4e-8, UNITS.second)).toBe('(6.23 ± 0.14) × 10⁻⁷ s');
  });

  it('when the value is negative, then the mantissa carries a true minus', () => {
    expect(formatEstimate(-3.456e5, 2.2e4)).toBe('(−3.5 ± 0.2) × 10⁵');
  });

  it('when the SE is larger than the value, then the value is rounded just as coarsely', () => {
    expect(formatEstimate(5.2, 340)).toBe('0 ± 300');
  });

  it('when no SE is known, then the value keeps three significant figures', () => {
    expect(formatEstimate(1.0712e7, null, UNITS.perMolarPerSecond)).toBe('1.07 × 10⁷ M⁻¹ s⁻¹');
    expect(formatEstimate(0.812, 0)).toBe('0.812');
  });

  it('when the SE is below a millionth of the value (exact, constructed data), then the value keeps three figures and the SE is shown as it is', () => {
    expect(formatEstimate(500, 3.2e-14, UNITS.perMolar)).toBe('500 ± 3.2 × 10⁻¹⁴ M⁻¹');
    expect(formatInterval(499.99999, 500.00001, 3.2e-14, 500)).toBe('500 to 500');
  });

  it('when split into parts, then the mantissa, SE and shared exponent come apart for layout', () => {
    expect(estimateParts(1.0712e7, 4.8e5)).toEqual({
      value: '1.07',
      standardError: '0.05',
      exponent: 7,
      lastDigit: -2,
    });
  });
});

describe('formatInterval', () => {
  it('when an interval is printed, then both ends stop at the SE’s decimal place and share the power of ten', () => {
    expect(formatInterval(9.66e6, 1.176e7, 4.8e5, 1.0712e7, UNITS.perMolarPerSecond)).toBe(
      '(0.97 to 1.18) × 10⁷ M⁻¹ s⁻¹',
    );
    expect(formatInterval(505.1, 559.7, 12.3, 532.4)).toBe('505 to 560');
    expect(formatInterval(-0.021, 0.2, 0.05, 0.09)).toBe('−0.02 to 0.20');
  });
});
