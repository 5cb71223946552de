import { describe, expect, it } from 'vitest';
import { formatNumber } from '@/features/studies/components/format';
import {
  formatElectronvolts,
  formatKilojoules,
  formatLifetime,
  formatVolts,
  solventName,
} from '@/features/library/components/library-format';
import { formatDate } from '@shared/format';

// Expected strings are the display conventions of the screens (common practice in papers: signed
// potentials with two decimals, powers of ten as × 10ⁿ), written out by hand.
describe('formatNumber', () => {
  it('when a value lies between 0.01 and 10 000, then it is written plainly to three significant figures', () => {
    expect(formatNumber(1234.5678)).toBe('1230');
    expect(formatNumber(0.0123456)).toBe('0.0123');
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(-42.25, 4)).toBe('−42.25');
  });

  it('when a value is very large or very small, then it gets a power of ten with a superscript exponent', () => {
    expect(formatNumber(5e8)).toBe('5.00 × 10⁸');
    expect(formatNumber(10000)).toBe('1.00 × 10⁴');
    expect(formatNumber(-2.5e-5)).toBe('−2.50 × 10⁻⁵');
    expect(formatNumber(1.234e10, 2)).toBe('1.2 × 10¹⁰');
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

describe('library formatters', () => {
  it('when a potential or an energy is shown, then it carries its sign (a true minus) and its unit', () => {
    expect(formatVolts(1.214)).toBe('+1.21 V');
    expect(formatVolts(-0.071)).toBe('−0.07 V');
    expect(formatElectronvolts(-0.336)).toBe('−0.34 eV');
    expect(formatElectronvolts(2.5, false)).toBe('2.50 eV');
    expect(formatKilojoules(-6.86)).toBe('−6.9 kJ mol⁻¹');
  });

  it('when a lifetime is shown, then ns below 1 µs and µs above, and an uncertainty keeps its value’s unit', () => {
    expect(formatLifetime(8.5e-7)).toBe('850 ns');
    expect(formatLifetime(1.9e-6)).toBe('1.90 µs');
    expect(formatLifetime(5.7e-8, 1.9e-6)).toBe('0.057 µs');
  });

  it('when a solvent id is shown, then the table’s name is used, and an unknown id is shown as typed', () => {
    expect(solventName('dmf')).toBe('N,N-dimethylformamide');
    expect(solventName('hexafluoroisopropanol')).toBe('hexafluoroisopropanol');
  });
});

describe('formatDate', () => {
  it('when a timestamp is shown, then the date is written out in words with the year', () => {
    expect(formatDate('2026-03-04T14:05:00.000Z')).toMatch(/2026/);
    expect(formatDate('2026-03-04T14:05:00.000Z')).not.toMatch(/T14/);
  });
});
