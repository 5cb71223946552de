import { describe, expect, it } from 'vitest';
import {
  CONCENTRATION_UNITS,
  concentrationDisplayUnit,
  fromSi,
  TIME_UNITS,
  timeDisplayUnit,
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
});
