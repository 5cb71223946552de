import { describe, expect, it } from 'vitest';
import {
  ENGINE_VERSION,
  FARADAY_CONSTANT,
  GAS_CONSTANT,
  KJ_PER_MOL_PER_EV,
  PHOTON_ENERGY_EV_NM,
  ELEMENTARY_CHARGE,
  VACUUM_PERMITTIVITY,
  electronvoltsToKilojoulesPerMole,
  fromCelsius,
  fromMicromolar,
  fromNanoseconds,
} from '@shared/engine';
import { expectClose } from './support/expect-close';

describe('CODATA 2018 constants (NIST CODATA recommended values, 2018)', () => {
  it('R, F, hc/e, eV in kJ/mol, e^2/(4 pi eps0)', () => {
    expectClose(GAS_CONSTANT, 8.314462618, 1e-10); // CODATA 2018, exact
    expectClose(FARADAY_CONSTANT, 96485.33212, 1e-10); // CODATA 2018, exact
    expectClose(PHOTON_ENERGY_EV_NM, 1239.841984, 1e-9); // computed from exact h, c, e (printed to 10 digits)
    expectClose(KJ_PER_MOL_PER_EV, 96.48533212, 1e-10); // computed e N_A / 1000
    expectClose(ELEMENTARY_CHARGE / (4 * Math.PI * VACUUM_PERMITTIVITY) / 1e-10, 14.399645, 1e-7); // eV Å
    expectClose(electronvoltsToKilojoulesPerMole(1), 96.485, 1e-5); // the kJ/mol factor rounded to 5 digits, as shared/engine/README.md section 6 prints it
  });

  it('unit helpers convert to SI-coherent values', () => {
    expect(fromMicromolar(10)).toBeCloseTo(1e-5, 20);
    expect(fromNanoseconds(1100)).toBeCloseTo(1.1e-6, 20);
    expect(fromCelsius(25)).toBe(298.15);
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
