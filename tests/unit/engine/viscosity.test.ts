import { describe, expect, it } from 'vitest';
import { GAS_CONSTANT, getSolvent, solventDiffusionLimitAt, viscosityAt } from '@shared/engine';
import { expectClose } from './support/expect-close';

const mPas = 1e-3;
const etaAt = (solvent: string, temperature: number): number =>
  viscosityAt(getSolvent(solvent).viscosityCorrelation!, temperature).value;

/*
 * Each solvent's eta(T) (one handbook correlation, named in SOLVENTS) against a second,
 * independent handbook at three temperatures. Expected values are that second handbook's
 * correlation evaluated at T from its coefficient file in CalebBell/chemicals (commit 82faef9,
 * chemicals/Viscosity/*.tsv) at T, or at 25 °C the value of a further handbook correlation:
 * - PPDS: VDI Heat Atlas, 2nd ed., "Dynamic viscosity of saturated liquids", PPDS eq. 9
 * - Perry: Perry's Chemical Engineers' Handbook, 8th ed., Table 2-313 (DIPPR eq. 101)
 * - VN: Viswanath & Natarajan, Data Book on the Viscosity of Liquids (1989), 3-term fit
 * - DDB: Dortmund Data Bank Vogel coefficients (as packaged in Deniz-Koseoglu/lcqc)
 * - Dutt–Prasad: the Dutt–Prasad 3-term fit (CalebBell/chemicals)
 * Tolerance 3 %: handbook correlations of one liquid commonly differ by 1–3 % (common practice).
 */
const crossChecks: Record<string, Array<[temperature: number, mPaS: number, source: string]>> = {
  acetonitrile: [
    [273.15, 0.446, 'PPDS'],
    [298.15, 0.349, 'PPDS'],
    [323.15, 0.2801, 'PPDS'],
  ],
  dmf: [
    [283.15, 0.9901, 'Perry'],
    [298.15, 0.794, '0.794 (VN; Dutt–Prasad 0.793)'],
    [313.15, 0.6858, 'Perry'],
  ],
  dmso: [
    [293.15, 2.1867, 'Perry'],
    [298.15, 1.983, 'Perry 1.983'],
    [323.15, 1.2894, 'Perry'],
  ],
  methanol: [
    [283.15, 0.6759, 'VN (within its 180–290 K range)'],
    [298.15, 0.544, '0.544 (VN, PPDS)'],
    [313.15, 0.4421, 'PPDS'],
  ],
  ethanol: [
    [273.15, 1.7511, 'PPDS'],
    [298.15, 1.062, 'PPDS 1.062'],
    [323.15, 0.683, 'PPDS'],
  ],
  dichloromethane: [
    [273.15, 0.533, 'VN'],
    [283.15, 0.4781, 'PPDS'],
    [298.15, 0.413, '0.413 (VN, PPDS)'],
  ],
  '1,2-dichloroethane': [
    [273.15, 1.0902, 'PPDS'],
    [298.15, 0.779, '0.779 (VN, Dutt–Prasad)'],
    [323.15, 0.5756, 'PPDS'],
  ],
  acetone: [
    [273.15, 0.3987, 'Perry'],
    [298.15, 0.305, 'PPDS 0.305'],
    [313.15, 0.2681, 'Perry'],
  ],
  toluene: [
    [273.15, 0.7779, 'PPDS'],
    [298.15, 0.552, 'PPDS 0.552'],
    [323.15, 0.4153, 'PPDS'],
  ],
  benzene: [
    [283.15, 0.7293, 'PPDS'],
    [298.15, 0.601, 'DDB Vogel 0.601'],
    [323.15, 0.444, 'PPDS'],
  ],
  'ethyl-acetate': [
    [273.15, 0.572, 'PPDS'],
    [298.15, 0.43, 'Perry 0.430'],
    [323.15, 0.33, 'PPDS'],
  ],
  '1,4-dioxane': [
    [293.15, 1.2968, 'PPDS'],
    [298.15, 1.187, 'PPDS 1.187'],
    [323.15, 0.8057, 'PPDS'],
  ],
  // No second handbook correlation for THF was found; one temperature only.
  thf: [[298.15, 0.468, 'DDB Vogel 0.468']],
};

describe('viscosity at temperature eta(T)', () => {
  for (const [solvent, checks] of Object.entries(crossChecks)) {
    it(`${solvent}: within 3 % of an independent handbook at ${checks.length} temperature(s)`, () => {
      for (const [temperature, expected] of checks) expectClose(etaAt(solvent, temperature), expected * mPas, 0.03);
    });
  }

  it('water: IAPWS 2008 at 0, 25 and 50 °C within 1 %', () => {
    expectClose(etaAt('water', 298.15), 0.89 * mPas, 0.005); // IAPWS 2008 viscosity formulation at 0.1 MPa (CalebBell/chemicals mu_IAPWS)
    // IAPWS 2008 values at 0.1 MPa, 0 °C 1.7914 and 50 °C 0.5465 mPa s: from memory
    expectClose(etaAt('water', 273.15), 1.7914 * mPas, 0.01);
    expectClose(etaAt('water', 323.15), 0.5465 * mPas, 0.01);
  });

  it('viscosity falls as the temperature rises, for every correlated solvent', () => {
    for (const solvent of [...Object.keys(crossChecks), 'water']) {
      expect(etaAt(solvent, 313.15)).toBeLessThan(etaAt(solvent, 293.15));
    }
  });

  it('warns outside the correlation range and still gives a value', () => {
    const dmf = getSolvent('dmf').viscosityCorrelation!; // Viswanath–Natarajan, valid 270–320 K
    expect(viscosityAt(dmf, 298.15).warning).toBeNull();
    const hot = viscosityAt(dmf, 333.15);
    expect(hot.withinRange).toBe(false);
    expect(hot.warning).toMatch(/outside the correlation's range \(270–320 K\)/);
    expect(hot.value).toBeGreaterThan(0);
  });

  it('a single known value (DMAc) is used unchanged, with a warning away from its temperature', () => {
    const dmac = getSolvent('dmac').viscosityCorrelation!;
    expect(viscosityAt(dmac, 298.15)).toEqual({ value: 0.945e-3, withinRange: true, warning: null });
    const warm = viscosityAt(dmac, 323.15);
    expect(warm.value).toBe(0.945e-3);
    expect(warm.warning).toMatch(/only one viscosity is known \(at 298\.15 K\)/);
  });
});

describe('diffusion limit at the study temperature k_diff = 8RT/3eta(T)', () => {
  // 8RT/3 with R = 8.314462618 J/(mol K) (CODATA 2018, exact) and eta from IAPWS 2008 (0 and
  // 50 °C from memory, see above): 0 °C 6056.3/1.7914e-3 = 3.381e9; 50 °C 7164.9/0.5465e-3 = 1.311e10.
  it('water at 0 °C and 50 °C', () => {
    expectClose((8 * GAS_CONSTANT * 273.15) / 3, 6056.3, 1e-5);
    expectClose(solventDiffusionLimitAt('water', 273.15).value, 3.381e9, 0.01);
    expectClose(solventDiffusionLimitAt('water', 323.15).value, 1.311e10, 0.01);
  });

  it('acetonitrile at 0 °C and 50 °C against the VDI viscosities', () => {
    // 8RT/3eta with PPDS eta: 0 °C 6056.3/0.446e-3 = 1.358e10; 50 °C 7164.9/0.2801e-3 = 2.558e10
    expectClose(solventDiffusionLimitAt('acetonitrile', 273.15).value, 1.358e10, 0.03);
    expectClose(solventDiffusionLimitAt('acetonitrile', 323.15).value, 2.558e10, 0.03);
  });

  it('when a study runs at 50 °C, then the limit is no longer the 25 °C value', () => {
    const at25 = solventDiffusionLimitAt('acetonitrile', 298.15);
    const at50 = solventDiffusionLimitAt('acetonitrile', 323.15);
    // more than the factor T alone (323.15/298.15 = 1.084): eta falls by a fifth as well
    expect(at50.value / at25.value).toBeGreaterThan(1.3);
    expect(at50.basis).toMatch(/323\.15 K/);
    expect(at50.warning).toBeNull();
  });

  it('names the range when the temperature lies outside it', () => {
    const cold = solventDiffusionLimitAt('1,4-dioxane', 278.15); // Perry's row starts at 284.95 K (the melting point)
    expect(cold.warning).toMatch(/^1,4-dioxane: 278\.15 K is outside the correlation's range \(284\.95–374\.65 K\)/);
  });

  it('TFE has no sourced viscosity and says so', () => {
    expect(() => solventDiffusionLimitAt('tfe', 298.15)).toThrowError(
      expect.objectContaining({ code: 'MISSING_SOLVENT_DATA' }),
    );
  });
});
