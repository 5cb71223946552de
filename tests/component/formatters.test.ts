import { describe, expect, it } from 'vitest';
import { formatNumber as screenFormatNumber } from '@/features/studies/components/format';
import {
  formatElectronvolts,
  formatKilojoules,
  formatLifetime,
  formatVolts,
  solventName,
} from '@/features/library/components/library-format';
import { formatDate, formatNumber } from '@shared/format';

// Expected strings are the display conventions of the screens (common practice in papers: signed
// potentials with two decimals, powers of ten as × 10ⁿ), written out by hand.
describe('formatNumber on the study screens', () => {
  it('when a study screen writes a number, then it uses the one shared formatter (its cases: tests/unit/format)', () => {
    expect(screenFormatNumber).toBe(formatNumber);
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
