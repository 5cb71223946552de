import { describe, expect, it } from 'vitest';
import {
  CONCENTRATION_UNITS,
  concentrationDisplayUnit,
  fromSi,
  TIME_UNITS,
  timeDisplayUnit,
  toKilojoulesPerMole,
  toMicromolar,
  toMicroseconds,
  toMillilitres,
  toMillimolar,
  toMillipascalSeconds,
  toNanoseconds,
  toSi,
  unitFromText,
  unitLabel,
  VOLUME_UNITS,
} from '@shared/units/units';

// SI prefixes: milli 1e-3, micro 1e-6, nano 1e-9 (BIPM, The International System of Units, 9th ed., 2019, table 7).
describe('units module', () => {
  it('when a value is converted to SI and back, then the prefixes are those of the SI brochure', () => {
    expect(CONCENTRATION_UNITS).toEqual({ M: 1, mM: 1e-3, uM: 1e-6, nM: 1e-9 });
    expect(TIME_UNITS).toEqual({ s: 1, ms: 1e-3, us: 1e-6, ns: 1e-9, ps: 1e-12 });
    expect(VOLUME_UNITS).toEqual({ L: 1, mL: 1e-3, uL: 1e-6 });
    expect(toSi(2.5, 'mM')).toBe(0.0025);
    expect(fromSi(1.1e-6, 'ns')).toBeCloseTo(1100, 9);
    expect(toSi(20, 'uL')).toBeCloseTo(2e-5, 20);
  });

  it('when a unit is written with the micro sign or the Greek mu, then it is the same unit', () => {
    expect(unitFromText('µM')).toBe('uM');
    expect(unitFromText('μs')).toBe('us');
    expect(unitFromText('furlong')).toBeNull();
    expect(unitLabel('uL')).toBe('µL');
  });

  it('when a display unit is chosen, then the largest value reads between 0.1 and 100', () => {
    expect(concentrationDisplayUnit(0.004)).toBe('mM');
    expect(concentrationDisplayUnit(0.5)).toBe('M');
    expect(concentrationDisplayUnit(5e-5)).toBe('uM');
    expect(timeDisplayUnit(1.1e-6)).toBe('us');
    expect(timeDisplayUnit(8e-9)).toBe('ns');
  });

  it('when an SI value is shown in a prefixed unit, then it is divided by the prefix (common practice)', () => {
    // mM = 1e-3 mol/L, µM = 1e-6 mol/L, mL = 1e-3 L, µs = 1e-6 s, ns = 1e-9 s (SI brochure, table 7);
    // 1 cP = 1 mPa s = 1e-3 Pa s; 1 kJ = 1e3 J (SI brochure, tables 4 and 7).
    expect(toMillimolar(0.0025)).toBeCloseTo(2.5, 12);
    expect(toMicromolar(1e-5)).toBeCloseTo(10, 12);
    expect(toMillilitres(0.003)).toBeCloseTo(3, 12);
    expect(toMicroseconds(1.9e-6)).toBeCloseTo(1.9, 12);
    expect(toNanoseconds(8.5e-7)).toBeCloseTo(850, 9);
    expect(toMillipascalSeconds(0.00089)).toBeCloseTo(0.89, 12);
    expect(toKilojoulesPerMole(41_000)).toBe(41);
  });

  it('when a value goes to SI and back through the helpers, then it comes back unchanged (to 1e-12)', () => {
    for (const value of [0.37, 2.5, 1100, 7e4]) {
      expect(toMillimolar(toSi(value, 'mM')) / value).toBeCloseTo(1, 12);
      expect(toNanoseconds(toSi(value, 'ns')) / value).toBeCloseTo(1, 12);
      expect(toMillilitres(toSi(value, 'mL')) / value).toBeCloseTo(1, 12);
      expect(toMillipascalSeconds(toSi(value, 'mPa s')) / value).toBeCloseTo(1, 12);
    }
  });
});
