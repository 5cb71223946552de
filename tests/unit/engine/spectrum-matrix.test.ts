import { describe, expect, it } from 'vitest';
import {
  analyseSpectrumMatrix,
  chiSquareUpperTail,
  EngineError,
  normalCdf,
  singularValues,
  spectralBands,
  spectralComponents,
  testKsvHomogeneity,
} from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal } from './support/seeded-random';

/** Synthetic emission (invented numbers): Gaussian bands on a 1 nm grid from 400 to 600 nm. */
const wavelengths = Array.from({ length: 201 }, (_, i) => 400 + i);
const band = (centre: number, width: number, height: number) =>
  wavelengths.map((nm) => height * Math.exp(-(((nm - centre) / width) ** 2) / 2));
const concentrations = [0, 0, 0.002, 0.004, 0.006, 0.008, 0.01];

function matrix(signal: (q: number) => number[], seed: number, noise = 5): number[][] {
  const normal = seededNormal(seed);
  return concentrations.map((q) => signal(q).map((value) => value + noise * normal()));
}
const add = (a: number[], b: number[]) => a.map((value, i) => value + b[i]!);
const scale = (a: number[], factor: number) => a.map((value) => value * factor);

const oneEmitter = (q: number) => scale(band(450, 20, 1000), 1 / (1 + 150 * q));
const twoEmitters = (q: number) =>
  add(scale(band(430, 15, 1000), 1 / (1 + 300 * q)), scale(band(500, 15, 1000), 1 / (1 + 30 * q)));
const exciplex = (q: number) =>
  add(scale(band(430, 15, 1000), 1 / (1 + 200 * q)), scale(band(530, 25, 600), (200 * q) / (1 + 200 * q)));

describe('chiSquareUpperTail', () => {
  it('when x is an upper 5 % critical value, then the tail is 0.05', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.4 (critical values of χ², α = 0.05), printed
    // to 3 decimals: the rounding of x alone moves the tail by up to 3e-4 relative.
    expectClose(chiSquareUpperTail(3.841, 1), 0.05, 1e-3);
    expectClose(chiSquareUpperTail(11.07, 5), 0.05, 1e-3);
    expectClose(chiSquareUpperTail(18.307, 10), 0.05, 1e-3);
  });
  it('when k = 1 or 2, then it matches the closed forms', () => {
    // k = 2: P = exp(-x/2); k = 1: P = 2 (1 − Φ(√x)) with Φ from @stdlib normal-cdf (textbook identities).
    expectClose(chiSquareUpperTail(5.5, 2), Math.exp(-2.75), 1e-12);
    expectClose(chiSquareUpperTail(2.3, 1), 2 * (1 - normalCdf(Math.sqrt(2.3))), 1e-10);
  });
});

describe('singularValues', () => {
  it('when the matrix is [[3, 0], [4, 5]], then they are √45 and √5', () => {
    // By hand: AᵀA = [[25, 20], [20, 25]] has eigenvalues 45 and 5.
    const [first, second] = singularValues([
      [3, 0],
      [4, 5],
    ]);
    expectClose(first!, Math.sqrt(45), 1e-12);
    expectClose(second!, Math.sqrt(5), 1e-12);
  });
  it('when the rows are multiples of one row, then one value is √(Σ entries²) and the other 0', () => {
    // By hand: [[1, 2], [2, 4], [3, 6]] = u vᵀ with |u| = √14, |v| = √5: σ1 = √70, σ2 = 0.
    const [first, second] = singularValues([
      [1, 2],
      [2, 4],
      [3, 6],
    ]);
    expectClose(first!, Math.sqrt(70), 1e-12);
    expect(second!).toBeLessThan(1e-12);
  });
});

describe('testKsvHomogeneity', () => {
  it('when three estimates are given, then χ² is the hand sum about the weighted mean', () => {
    // By hand: w = 1, 1, 1/4; K̄ = (10 + 12 + 15/4) / 2.25 = 11.444…;
    // χ² = 1.444…² + 0.555…² + (3.555…/2)² = 5.5556; p = exp(-χ²/2) for 2 degrees of freedom.
    const result = testKsvHomogeneity([
      { value: 10, standardError: 1 },
      { value: 12, standardError: 1 },
      { value: 15, standardError: 2 },
    ]);
    expectClose(result.weightedMean, 25.75 / 2.25, 1e-12);
    expectClose(result.chiSquare, 50 / 9, 1e-12);
    expect(result.degreesOfFreedom).toBe(2);
    expectClose(result.pValue, Math.exp(-25 / 9), 1e-10);
    expectClose(result.weightedMeanStandardError, 1 / Math.sqrt(2.25), 1e-12);
  });
  it('when only one estimate is given, then it says a test needs two', () => {
    expect(() => testKsvHomogeneity([{ value: 1, standardError: 1 }])).toThrow(/at least 2 estimates/);
  });
});

describe('spectralBands', () => {
  it('when the width is 2 nm, then readings are summed two by two', () => {
    const bands = spectralBands([400, 401, 402, 403, 404], [[1, 2, 3, 4, 5]], 2);
    // By hand: 1 + 2, 3 + 4, 5.
    expect(bands.map((b) => b.intensities[0])).toEqual([3, 7, 5]);
    expect(bands.map((b) => [b.start, b.end])).toEqual([
      [400, 401],
      [402, 403],
      [404, 404],
    ]);
  });
  it('when the width is 0, then each wavelength is its own band', () => {
    expect(spectralBands([400, 401, 402], [[1, 2, 3]], 0)).toHaveLength(3);
  });
  it('when a spectrum is on another grid, then it names that spectrum', () => {
    expect(() =>
      spectralBands(
        [400, 401, 402],
        [
          [1, 2, 3],
          [1, 2],
        ],
        1,
      ),
    ).toThrow(/spectra\[1\]: has 2 readings/);
  });
  it('when the wavelengths do not increase, then it names where', () => {
    expect(() => spectralBands([400, 402, 401], [[1, 2, 3]], 1)).toThrow(/wavelengths\[2\]/);
  });
});

describe('spectralComponents', () => {
  it('when every spectrum is one shape scaled, then one component stands out', () => {
    const result = spectralComponents(matrix(oneEmitter, 11));
    expect(result.significant).toBe(1);
    // The noise estimate from second differences finds the 5-count noise that was added: one spectrum's
    // estimate scatters by about 15 % (a median of 199 correlated differences), the mean of 7 within 10 %.
    const mean = result.noiseLevels.reduce((sum, sigma) => sum + sigma, 0) / result.noiseLevels.length;
    expectClose(mean, 5, 0.1);
  });
  it('when two shapes change weight with [Q], then two components stand out', () => {
    expect(spectralComponents(matrix(twoEmitters, 12)).significant).toBe(2);
  });
});

describe('analyseSpectrumMatrix (Lakowicz, 3rd ed., ch. 8)', () => {
  it('when one emitter is quenched, then K_SV is the same in every band and nothing is flagged', () => {
    const result = analyseSpectrumMatrix({
      wavelengths,
      concentrations,
      spectra: matrix(oneEmitter, 1),
      bandWidth: 10,
    });
    expect(result.flags).toEqual([]);
    expect(result.components.significant).toBe(1);
    const homogeneity = result.homogeneity!;
    expect(homogeneity.homogeneous).toBe(true);
    // The K_SV used to make the data: 150 M^-1 (invented); recovered within 3 SE of the weighted mean.
    expect(Math.abs(homogeneity.weightedMean - 150)).toBeLessThan(3 * homogeneity.weightedMeanStandardError);
    // χ² is the hand sum over the bands' K_SV about their inverse-variance weighted mean.
    const estimates = result.bands.flatMap((b) => (b.kSv ? [b.kSv] : []));
    const weights = estimates.map((e) => 1 / e.standardError ** 2);
    const mean = estimates.reduce((sum, e, i) => sum + weights[i]! * e.value, 0) / weights.reduce((a, b) => a + b, 0);
    const chiSquare = estimates.reduce((sum, e) => sum + ((e.value - mean) / e.standardError) ** 2, 0);
    expectClose(homogeneity.chiSquare, chiSquare, 1e-12);
    expect(homogeneity.degreesOfFreedom).toBe(estimates.length - 1);
  });

  it('when one emitter is quenched, then a flag or a second component comes up in about 1 % of noisy matrices', () => {
    let flagged = 0;
    let extraComponent = 0;
    for (let seed = 100; seed < 200; seed++) {
      const result = analyseSpectrumMatrix({
        wavelengths,
        concentrations,
        spectra: matrix(oneEmitter, seed),
        bandWidth: 10,
      });
      if (result.flags.length > 0) flagged++;
      if (result.components.significant !== 1) extraComponent++;
    }
    // The χ² level is 1 % (1 in 100 seen when this was written); allow up to 5 in 100 for the scatter of a count.
    expect(flagged).toBeLessThanOrEqual(5);
    expect(extraComponent).toBeLessThanOrEqual(5);
  });

  it('when two emitters with different K_SV overlap, then K_SV varies across the bands and two components show', () => {
    const result = analyseSpectrumMatrix({
      wavelengths,
      concentrations,
      spectra: matrix(twoEmitters, 2),
      bandWidth: 10,
    });
    expect(result.homogeneity!.homogeneous).toBe(false);
    expect(result.flags.map((f) => f.code)).toEqual(['KSV_VARIES_WITH_WAVELENGTH']);
    expect(result.flags[0]!.title).toBe('Two emitting species or an exciplex may be present');
    expect(result.components.significant).toBe(2);
    // Blue bands carry the strongly quenched emitter (300 M^-1), red bands the weakly quenched one (30 M^-1).
    const blue = result.bands.find((b) => b.start === 430)!.kSv!.value;
    const red = result.bands.find((b) => b.start === 500)!.kSv!.value;
    expect(blue).toBeGreaterThan(200);
    expect(red).toBeLessThan(60);
  });

  it('when an exciplex band grows with [Q], then the new component is flagged where the emission rises', () => {
    const result = analyseSpectrumMatrix({ wavelengths, concentrations, spectra: matrix(exciplex, 3), bandWidth: 10 });
    expect(result.components.significant).toBeGreaterThanOrEqual(2);
    expect(result.flags.map((f) => f.code)).toContain('NEW_COMPONENT_GROWS');
    const rising = result.bands.filter((b) => b.rises);
    // Rising bands lie where the monomer (430 nm, 15 nm wide) has faded, none on its own band.
    expect(rising.every((b) => b.centre > 470)).toBe(true);
    expect(result.bands.find((b) => b.start === 530)!.rises).toBe(true);
  });

  it('when the width is 0, then K_SV comes per wavelength', () => {
    const result = analyseSpectrumMatrix({ wavelengths, concentrations, spectra: matrix(oneEmitter, 4), bandWidth: 0 });
    expect(result.bands).toHaveLength(wavelengths.length);
  });

  it('when there is no blank or too few concentrations, then it says what is missing', () => {
    const spectra = matrix(oneEmitter, 5);
    const noBlank = concentrations.map((c) => c + 0.001);
    expect(() => analyseSpectrumMatrix({ wavelengths, concentrations: noBlank, spectra, bandWidth: 10 })).toThrow(
      /no spectrum at \[Q\] = 0/,
    );
    expect(() =>
      analyseSpectrumMatrix({
        wavelengths,
        concentrations: [0, 0, 0.001],
        spectra: spectra.slice(0, 3),
        bandWidth: 10,
      }),
    ).toThrow(EngineError);
    expect(() => analyseSpectrumMatrix({ wavelengths, concentrations: [0, 0.001], spectra, bandWidth: 10 })).toThrow(
      /7 spectra but 2 concentrations/,
    );
  });
});
