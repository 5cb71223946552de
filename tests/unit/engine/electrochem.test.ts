import { describe, expect, it } from 'vitest';
import {
  convertPotential,
  coulombWorkTerm,
  e00FromWavelength,
  EngineError,
  electronTransferDrivingForce,
  energyTransferFeasibility,
  excitedStatePotentials,
  quenchingDrivingForces,
} from '@shared/engine';
import { expectClose } from './support/expect-close';

// ±0.01 V when recomputing a source from its own inputs (sources round to 0.01 V) and ±0.05 V
// across different sources (common practice).
const WITHIN_ROUNDING = 0.01;

describe('reference-electrode conversions (Bard & Faulkner 2nd ed.; Pavlishchuk & Addison 2000)', () => {
  it('SCE = +0.2412 V, Ag/AgCl sat. = +0.197 V, Ag/AgCl 3 M = +0.210 V vs SHE', () => {
    expectClose(convertPotential({ value: 0, from: 'SCE', to: 'SHE' }).value, 0.2412, 1e-12); // Bard & Faulkner
    expectClose(convertPotential({ value: 0, from: 'Ag/AgCl (sat. KCl)', to: 'SHE' }).value, 0.197, 1e-12); // Bard & Faulkner
    expectClose(convertPotential({ value: 0, from: 'Ag/AgCl (3 M KCl)', to: 'SHE' }).value, 0.21, 1e-12); // Inzelt et al.
    // SCE - Ag/AgCl(sat) = 0.2412 - 0.197 = 0.044 V (Bard & Faulkner values, computed)
    expectClose(convertPotential({ value: 0, from: 'SCE', to: 'Ag/AgCl (sat. KCl)' }).value, 0.0442, 1e-9);
  });

  it('acetonitrile: Fc+/Fc = +0.380 V vs SCE, Ag/Ag+ = +0.298 V vs SCE, Fc vs Ag/Ag+ = +0.082 V', () => {
    expectClose(convertPotential({ value: 0, from: 'Fc+/Fc', to: 'SCE', solvent: 'acetonitrile' }).value, 0.38, 1e-12); // Pavlishchuk & Addison 2000
    expectClose(
      convertPotential({ value: 0, from: 'Ag/Ag+ (0.01 M AgNO3)', to: 'SCE', solvent: 'acetonitrile' }).value,
      0.298,
      1e-12,
    ); // P&A 2000
    const fcVsAg = convertPotential({ value: 0, from: 'Fc+/Fc', to: 'Ag/Ag+ (0.01 M AgNO3)', solvent: 'acetonitrile' });
    expectClose(fcVsAg.value, 0.082, 1e-9); // 0.380 - 0.298 (both Pavlishchuk & Addison 2000, computed)
    expect(fcVsAg.warnings).toEqual([]); // both references sit in the same organic solution
  });

  it('Ru(bpy)3 3+/2+: +1.29 V vs SCE (Prier 2013) is +0.92 V vs Fc (JACS 2023) within 0.05 V', () => {
    // different sources (the Prier value is from memory): ±0.05 V
    const converted = convertPotential({ value: 1.29, from: 'SCE', to: 'Fc+/Fc', solvent: 'acetonitrile' });
    expect(Math.abs(converted.value - 0.92)).toBeLessThan(0.05);
  });

  it('dichloromethane Fc+/Fc (Connelly & Geiger 0.46 V) lies within 0.05 V of the measured 0.48–0.51 V', () => {
    const value = convertPotential({ value: 0, from: 'Fc+/Fc', to: 'SCE', solvent: 'dichloromethane' }).value;
    expect(Math.abs(value - 0.48)).toBeLessThanOrEqual(0.05); // PMC8336439 Table 2 footnote (primary)
  });

  it('warns about junction potentials and recommends Fc+/Fc for organic solvents', () => {
    const toFc = convertPotential({ value: -1.33, from: 'SCE', to: 'Fc+/Fc', solvent: 'acetonitrile' });
    expect(toFc.warnings.map((w) => w.code)).toEqual(['JUNCTION_POTENTIAL']);
    const toSce = convertPotential({ value: 0.5, from: 'Fc+/Fc', to: 'SCE', solvent: 'acetonitrile' });
    expect(toSce.warnings.map((w) => w.code)).toEqual(['JUNCTION_POTENTIAL', 'PREFER_FERROCENE_REFERENCE']);
    expect(toSce.constants.map((c) => c.source).join(' ')).toMatch(/Pavlishchuk & Addison/);
    expect(convertPotential({ value: 0.5, from: 'SCE', to: 'SHE', solvent: 'water' }).warnings).toEqual([]);
  });

  it('unknown electrode, or Fc+/Fc without a sourced solvent, is a typed error', () => {
    expect(() => convertPotential({ value: 0, from: 'Hg/HgO', to: 'SHE' })).toThrowError(
      expect.objectContaining({
        code: 'UNKNOWN_REFERENCE_ELECTRODE',
        message: expect.stringMatching(/^from: "Hg\/HgO" is not a known reference electrode\. Use one of: SHE, SCE/),
      }),
    );
    expect(() => convertPotential({ value: 0, from: 'Fc+/Fc', to: 'SCE' })).toThrowError(
      expect.objectContaining({ code: 'REFERENCE_NOT_AVAILABLE_FOR_SOLVENT' }),
    );
    expect(() => convertPotential({ value: 0, from: 'Fc+/Fc', to: 'SCE', solvent: 'water' })).toThrowError(EngineError);
  });
});

describe('E00 from a wavelength', () => {
  it('E = 1239.841984 / lambda (CODATA 2018 h, c, e exact)', () => {
    expectClose(e00FromWavelength(1239.841984), 1, 1e-9);
    expectClose(e00FromWavelength(494), 2.51, 0.002); // fac-Ir(ppy)3 at 494 nm: 1239.84/494 = 2.51 (by hand)
    expectClose(e00FromWavelength(625), 1.98, 0.002); // 1239.84/625 = 1.98 (by hand)
  });

  it('rejects wavelengths outside 200–1500 nm with a typed error', () => {
    expect(() => e00FromWavelength(150)).toThrowError(expect.objectContaining({ code: 'WAVELENGTH_OUT_OF_RANGE' }));
    expect(() => e00FromWavelength(2.1)).toThrowError(
      /^wavelength: 2.1 nm is outside 200–1500 nm\. Enter the wavelength in nanometres\.$/,
    );
    expect(() => e00FromWavelength(Number.NaN)).toThrowError(expect.objectContaining({ code: 'NON_FINITE_VALUE' }));
  });
});

describe('excited-state potentials E* = E -+ E00 (published rows: PMC6050529, PMC5811153, Sci. Rep. 4045)', () => {
  // [source, E(PC+/PC), E(PC/PC-), E00, E*(PC+/PC*), E*(PC*/PC-)], V vs SCE (Sci. Rep. rows vs NHE)
  const rows: [string, number, number, number, number, number][] = [
    ['PMC6050529 4CzIPN lit', 1.52, -1.21, 2.56, -1.04, 1.35],
    ['PMC6050529 4CzIPN measured', 1.68, -1.05, 2.64, -0.96, 1.59],
    ['PMC6050529 4a MeCN', 1.56, -1.29, 2.64, -1.08, 1.35],
    ['PMC6050529 4c MeCN', 1.76, -1.1, 2.68, -0.92, 1.58],
    ['PMC6050529 4d MeCN', 1.89, -0.83, 2.65, -0.76, 1.82],
    ['PMC6050529 4a CH2Cl2', 1.67, -1.29, 2.59, -0.92, 1.3],
    ['PMC6050529 4b CH2Cl2', 1.79, -1.18, 2.6, -0.81, 1.42],
    ['PMC6050529 4c CH2Cl2', 1.87, -1.1, 2.59, -0.72, 1.49],
    ['PMC6050529 4d CH2Cl2', 1.98, -0.85, 2.58, -0.6, 1.73],
    ['PMC5811153 Ptdfppy', 0.62, -2.46, 2.73, -2.11, 0.27],
    ['PMC5811153 Ptppy', 0.57, -2.38, 2.64, -2.07, 0.26],
    ['PMC5811153 PtOMe', 0.52, -2.2, 2.45, -1.93, 0.25],
    ['Sci. Rep. 4045 Ir 1', 1.49, -1.12, 2.58, -1.09, 1.46],
    ['Sci. Rep. 4045 Ir 2', 1.22, -1.12, 2.34, -1.12, 1.22],
    ['Sci. Rep. 4045 Ir 3', 1.44, -1.01, 2.41, -0.97, 1.4],
    ['Sci. Rep. 4045 Ir 4', 1.72, -1.11, 2.67, -0.95, 1.56],
    ['Sci. Rep. 4045 Ir 5', 1.33, -1.1, 2.37, -1.04, 1.27],
    ['Sci. Rep. 4045 Ir 6', 1.25, -1.45, 2.73, -1.48, 1.28],
  ];
  it.each(rows)('%s', (_source, oxidation, reduction, e00, excitedOxidation, excitedReduction) => {
    const result = excitedStatePotentials({ oxidation, reduction, e00 });
    expect(Math.abs(result.excitedOxidation! - excitedOxidation)).toBeLessThanOrEqual(WITHIN_ROUNDING + 1e-12);
    expect(Math.abs(result.excitedReduction! - excitedReduction)).toBeLessThanOrEqual(WITHIN_ROUNDING + 1e-12);
  });

  it('needs at least one ground-state potential', () => {
    expect(() => excitedStatePotentials({ e00: 2 })).toThrowError(
      expect.objectContaining({ code: 'MISSING_POTENTIAL' }),
    );
  });
});

describe('Coulomb work term (IUPAC Gold Book GT07388)', () => {
  it('neutral pair in acetonitrile at 7 Å: -0.058 eV (eps 35.69)', () => {
    expect(Math.abs(coulombWorkTerm({ permittivity: 35.69 }) - -0.058)).toBeLessThan(0.0005); // -14.3996/(35.69 x 7) eV (computed)
    expectClose(coulombWorkTerm({ permittivity: 1, distance: 1e-10 }), -14.399645, 1e-7); // e^2/(4 pi eps0) = 14.399645 eV Å (§4)
  });

  it('other solvents and distances by the same formula: MeCN 5 and 10 Å, CH2Cl2, DMF, DMSO, water', () => {
    const cases: [number, number, number][] = [
      [35.69, 5e-10, -0.081],
      [35.69, 10e-10, -0.04],
      [8.93, 7e-10, -0.23],
      [37.22, 7e-10, -0.055],
      [46.83, 7e-10, -0.044],
      [78.36, 7e-10, -0.026],
    ];
    for (const [permittivity, distance, expected] of cases) {
      expect(Math.abs(coulombWorkTerm({ permittivity, distance }) - expected)).toBeLessThan(0.0006);
    }
  });

  it('charges: products minus reactants, e.g. cationic donor and neutral acceptor give -1 + 0 ... ', () => {
    // D+ (z=+1) -> D2+ (+2), A (0) -> A- (-1): (2)(-1) - (1)(0) = -2 units
    expectClose(
      coulombWorkTerm({ donorCharge: 1, acceptorCharge: 0, permittivity: 35.69 }),
      2 * coulombWorkTerm({ permittivity: 35.69 }),
      1e-12,
    );
    // D (0), A+ (+1) -> D+ (+1), A (0): 0 - 0 = no work term
    expect(coulombWorkTerm({ donorCharge: 0, acceptorCharge: 1, permittivity: 35.69 })).toBe(0);
  });
});

describe('driving force dG_ET = e[E(D+/D) - E(A/A-)] - E00 + w', () => {
  it('Ru(bpy)3 2+* (E* = -0.81 V) to [Cp*Rh(bpy)(H2O)]2+ (E_red = -0.74 V): -0.07 eV', () => {
    // Inorg. Chem. 2023, 62, 7636, Table 2 (confirmed); E(PC+/PC) 1.29 and E00 2.10 (Prier 2013,
    // memory) only serve to build E* = -0.81 V, which that table confirms.
    const result = electronTransferDrivingForce({ donorOxidation: 1.29, acceptorReduction: -0.74, e00: 2.1 });
    expect(Math.abs(result.electronvolts - -0.07)).toBeLessThanOrEqual(WITHIN_ROUNDING);
    expectClose(result.kilojoulesPerMole, result.electronvolts * 96.48533212, 1e-9); // CODATA 2018 e N_A, printed to 10 digits
  });

  it('reductive quenching, PMC10620908 Table 1 dye 1: -[(-1.20 + 2.05) - 0.72] = -0.13 eV', () => {
    const forces = quenchingDrivingForces({ catalyst: { reduction: -1.2, e00: 2.05 }, quencher: { oxidation: 0.72 } });
    expect(forces.oxidative).toBeNull();
    expect(Math.abs(forces.reductive!.electronvolts - -0.13)).toBeLessThanOrEqual(WITHIN_ROUNDING);
    expect(forces.favoured).toBe('reductive');
  });

  it('picks the more favourable route, honours a pin, and adds the Coulomb term when asked', () => {
    const catalyst = { oxidation: 1.29, reduction: -1.33, e00: 2.1 };
    const quencher = { oxidation: 0.76, reduction: -0.74 };
    const plain = quenchingDrivingForces({ catalyst, quencher });
    expectClose(plain.oxidative!.electronvolts, -0.07, 1e-9);
    expectClose(plain.reductive!.electronvolts, 0.76 + 1.33 - 2.1, 1e-9);
    expect(plain.favoured).toBe('oxidative');
    expect(quenchingDrivingForces({ catalyst, quencher, pinned: 'reductive' }).highlighted).toBe('reductive');
    const withWork = quenchingDrivingForces({ catalyst, quencher, coulomb: { permittivity: 35.69 } });
    expectClose(withWork.oxidative!.workTerm, coulombWorkTerm({ permittivity: 35.69 }), 1e-12);
    expect(() => quenchingDrivingForces({ catalyst: { e00: 2 }, quencher: {} })).toThrowError(
      expect.objectContaining({ code: 'MISSING_POTENTIAL' }),
    );
  });
});

describe('energy transfer feasibility', () => {
  it('possible only when the quencher triplet lies below the catalyst triplet', () => {
    // Eosin Y E_T 1.89 eV = 43.6 kcal/mol (a vendor page quoting 43.6 kcal/mol; 43.6/23.0605 = 1.891 eV, computed)
    expect(energyTransferFeasibility({ catalystTripletEnergy: 1.89, quencherTripletEnergy: 1.6 }).possible).toBe(true);
    const uphill = energyTransferFeasibility({ catalystTripletEnergy: 1.89, quencherTripletEnergy: 2.2 });
    expect(uphill.possible).toBe(false);
    expectClose(uphill.energyDifferenceKilojoulesPerMole, 0.31 * 96.48533212, 1e-9);
  });
});
