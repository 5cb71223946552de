import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { Matrix, inverse } from 'ml-matrix';
import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  absorptionDifferences,
  analyseAbsorptionTitration,
  compareAssociationConstants,
  EngineError,
  fitBenesiHildebrand,
  fitBindingIsotherm,
  normalUpperQuantile,
  secondDifferenceNoise,
  type AbsorptionTitrationInput,
} from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal } from './support/seeded-random';

/*
 * Synthetic UV-vis titrations (invented numbers): an emitter band at 450 nm, a complex that
 * absorbs to the red, a quencher that absorbs in the near UV, on a 1 nm grid from 350 to 550 nm.
 * A = l (ε_E [E]0 + Δε [EQ] + ε_Q [Q]0), with [EQ] from the exact 1:1 mass balance.
 */
const wavelengths = Array.from({ length: 201 }, (_, i) => 350 + i);
const gauss = (centre: number, width: number, height: number) =>
  wavelengths.map((nm) => height * Math.exp(-(((nm - centre) / width) ** 2) / 2));
const epsilonEmitter = gauss(450, 25, 14000);
const deltaEpsilon = gauss(480, 30, 9000).map((value, i) => value - 0.6 * epsilonEmitter[i]!);
const epsilonQuencher = gauss(360, 20, 20);

/** [EQ] for total [E]0, [Q]0 and K (the smaller root of the 1:1 mass balance, written without cancellation). */
function complex(e0: number, q0: number, k: number): number {
  const s = e0 + q0 + 1 / k;
  return (2 * e0 * q0) / (s + Math.sqrt(s * s - 4 * e0 * q0));
}

function titration(options: {
  k: number;
  e0: number;
  concentrations: number[];
  noise: number;
  seed: number;
  complexes?: boolean;
}): number[][] {
  const normal = seededNormal(options.seed);
  return options.concentrations.map((q) => {
    const eq = options.complexes === false ? 0 : complex(options.e0, q, options.k);
    return wavelengths.map(
      (_, i) =>
        epsilonEmitter[i]! * options.e0 + deltaEpsilon[i]! * eq + epsilonQuencher[i]! * q + options.noise * normal(),
    );
  });
}

const excess = [0, 0.002, 0.004, 0.006, 0.008, 0.012, 0.016, 0.02];

describe('analyseAbsorptionTitration', () => {
  it('when a 1:1 complex forms with the quencher in excess, then the isotherm recovers K_a within 2 %', () => {
    // K_a = 150 M⁻¹ and [E]0 = 20 µM (invented); σ = 0.001 absorbance per reading.
    const input: AbsorptionTitrationInput = {
      wavelengths,
      concentrations: excess,
      spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 7 }),
      pathLength: 1,
      bandWidth: 10,
      emitterConcentration: 2e-5,
      quencher: { kind: 'absorptivity', values: epsilonQuencher },
    };
    const analysis = analyseAbsorptionTitration(input);
    expect(analysis.flags.map((flag) => flag.code)).toEqual(['ABSORPTION_CHANGES']);
    const binding = analysis.binding!;
    // the band of largest change lies on the complex's band (Δε largest near 490–500 nm in this model)
    expect(binding.band.centre).toBeGreaterThan(470);
    expect(binding.band.centre).toBeLessThan(520);
    const isotherm = binding.isotherm.fit!;
    expect(isotherm.form).toBe('exact');
    expect(Math.abs(isotherm.kA.value / 150 - 1)).toBeLessThan(0.02);
    // the truth lies within 3 SE of the estimate (a 99.7 % statement for one seed)
    expect(Math.abs(isotherm.kA.value - 150)).toBeLessThan(3 * isotherm.kA.standardError);
    const bh = binding.benesiHildebrand.fit!;
    expect(Math.abs(bh.kA.value / 150 - 1)).toBeLessThan(0.05);
    expect(Math.abs(bh.kA.value - 150)).toBeLessThan(3 * bh.kA.standardError);
    // Δε of the band recovered: the model's mean Δε over the chosen band (invented model above)
    const inBand = wavelengths.flatMap((nm, i) => (nm >= binding.band.start && nm <= binding.band.end ? [i] : []));
    const trueDelta = inBand.reduce((sum, i) => sum + deltaEpsilon[i]!, 0) / inBand.length;
    expect(Math.abs(binding.deltaEpsilon!.value / trueDelta - 1)).toBeLessThan(0.02);
  });

  it('when [Q] is not in large excess, then the exact isotherm still recovers K_a within 2 % and Benesi–Hildebrand is cautioned', () => {
    // K_a = 2 × 10⁴ M⁻¹, [E]0 = 50 µM, [Q] up to 4 [E]0 (invented); σ = 0.0005.
    const concentrations = [0, 1e-5, 2e-5, 4e-5, 6e-5, 1e-4, 1.5e-4, 2e-4];
    const analysis = analyseAbsorptionTitration({
      wavelengths,
      concentrations,
      spectra: titration({ k: 2e4, e0: 5e-5, concentrations, noise: 5e-4, seed: 11 }),
      pathLength: 1,
      bandWidth: 10,
      emitterConcentration: 5e-5,
      quencher: { kind: 'absorptivity', values: epsilonQuencher },
    });
    const isotherm = analysis.binding!.isotherm.fit!;
    expect(Math.abs(isotherm.kA.value / 2e4 - 1)).toBeLessThan(0.02);
    expect(analysis.notes.some((note) => note.startsWith('Benesi–Hildebrand assumes'))).toBe(true);
  });

  it('when the spectra are only emitter plus quencher, then nothing is flagged and no K_a is fitted', () => {
    // Five seeds of pure noise on the sum of the parts; the quencher given as its own spectrum at 50 mM.
    for (const seed of [1, 2, 3, 4, 5]) {
      const normal = seededNormal(100 + seed);
      const analysis = analyseAbsorptionTitration({
        wavelengths,
        concentrations: excess,
        spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed, complexes: false }),
        pathLength: 1,
        bandWidth: 0,
        quencher: {
          kind: 'spectrum',
          concentration: 0.05,
          values: epsilonQuencher.map((epsilon) => epsilon * 0.05 + 1e-3 * normal()),
        },
      });
      expect(analysis.flags).toEqual([]);
      expect(analysis.binding).toBeNull();
      expect(analysis.largestChange.z).toBeLessThan(analysis.threshold.z);
    }
  });

  it("when the quencher's own absorbance is not subtracted, then its share shows as change and a note says so", () => {
    const analysis = analyseAbsorptionTitration({
      wavelengths,
      concentrations: excess,
      spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 3, complexes: false }),
      pathLength: 1,
      bandWidth: 10,
    });
    expect(analysis.quencherCorrection).toBe('none');
    expect(analysis.flags).toHaveLength(1);
    expect(analysis.largestChange.centre).toBeLessThan(380);
    expect(analysis.notes[0]).toMatch(/not subtracted/);
  });

  it('when the noise is known, then the estimate from second differences finds it', () => {
    // σ = 0.001 put in; the estimator's SE for 200 readings is about 8 % (MAD efficiency, from memory)
    const analysis = analyseAbsorptionTitration({
      wavelengths,
      concentrations: excess,
      spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 9 }),
      pathLength: 1,
      bandWidth: 10,
      quencher: { kind: 'absorptivity', values: epsilonQuencher },
    });
    // a difference of two spectra has σ√2 (one blank)
    for (const sigma of analysis.noiseLevels.slice(1)) expectClose(sigma, 1e-3 * Math.SQRT2, 0.25);
  });

  it('when K_S from the study is given, then K_a is compared with it', () => {
    const analysis = analyseAbsorptionTitration({
      wavelengths,
      concentrations: excess,
      spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 7 }),
      pathLength: 1,
      bandWidth: 10,
      emitterConcentration: 2e-5,
      quencher: { kind: 'absorptivity', values: epsilonQuencher },
      staticConstant: { value: 148, standardError: 6, interval95: { lower: 136, upper: 160 } },
    });
    expect(analysis.comparison!.isotherm!.agree).toBe(true);
    expect(analysis.comparison!.kS.value).toBe(148);
  });

  it('when the spectra are on different grids, then it says so', () => {
    const spectra = titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 7 });
    spectra[3] = spectra[3]!.slice(0, 150);
    const run = () =>
      analyseAbsorptionTitration({ wavelengths, concentrations: excess, spectra, pathLength: 1, bandWidth: 10 });
    expect(run).toThrow(EngineError);
    expect(run).toThrow(
      /spectra\[3\]: has 150 readings but the titration has 201 wavelengths.*different wavelength grids/,
    );
    const quencherOffGrid = () =>
      analyseAbsorptionTitration({
        wavelengths,
        concentrations: excess,
        spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 7 }),
        pathLength: 1,
        bandWidth: 10,
        quencher: { kind: 'spectrum', concentration: 0.05, values: epsilonQuencher.slice(1) },
      });
    expect(quencherOffGrid).toThrow(/quencher: has 200 readings.*different wavelength grids/);
  });

  it('when there are too few concentrations, no blank or a bad path length, then it refuses naming the field', () => {
    const base = { wavelengths, pathLength: 1, bandWidth: 10 };
    const three = [0, 0.01, 0.02];
    expect(() =>
      analyseAbsorptionTitration({
        ...base,
        concentrations: three,
        spectra: titration({ k: 150, e0: 2e-5, concentrations: three, noise: 1e-3, seed: 1 }),
      }),
    ).toThrow(expect.objectContaining({ code: 'TOO_FEW_CONCENTRATIONS', field: 'concentrations' }));
    const noBlank = [0.001, 0.01, 0.02, 0.03];
    expect(() =>
      analyseAbsorptionTitration({
        ...base,
        concentrations: noBlank,
        spectra: titration({ k: 150, e0: 2e-5, concentrations: noBlank, noise: 1e-3, seed: 1 }),
      }),
    ).toThrow(expect.objectContaining({ code: 'MISSING_I0' }));
    expect(() =>
      analyseAbsorptionTitration({
        ...base,
        pathLength: -1,
        concentrations: excess,
        spectra: titration({ k: 150, e0: 2e-5, concentrations: excess, noise: 1e-3, seed: 1 }),
      }),
    ).toThrow(expect.objectContaining({ code: 'NON_POSITIVE_VALUE', field: 'pathLength' }));
  });
});

describe('absorptionDifferences', () => {
  it('when the quencher is given as ε, then [Q] ε l is taken out of each spectrum (Beer–Lambert, by hand)', () => {
    // By hand: 0.6 − 0.01 × 10 × 1 − 0.5 = 0; 0.45 − 0.01 × 5 × 1 − 0.4 = 0; with l = 2: 0.6 − 0.2 − 0.5 = −0.1.
    const input = {
      wavelengths: [400, 410],
      concentrations: [0, 0.01],
      spectra: [
        [0.5, 0.4],
        [0.6, 0.45],
      ],
      pathLength: 1,
      quencher: { kind: 'absorptivity' as const, values: [10, 5] },
    };
    const [d0, d1] = absorptionDifferences(input).differences[1]!;
    expectClose(d0! + 1, 1, 1e-12);
    expectClose(d1! + 1, 1, 1e-12);
    expectClose(absorptionDifferences({ ...input, pathLength: 2 }).differences[1]![0]!, -0.1, 1e-12);
  });
});

describe('fitBenesiHildebrand', () => {
  it('when the points lie on a 1:1 isotherm, then intercept/slope is K_a (hand calculation)', () => {
    // By hand, ΔA∞ = 0.25 and K = 500 M⁻¹: ΔA = 0.25 · 500[Q]/(1 + 500[Q]) at 1, 2 and 4 mM is 1/12, 1/8 and 1/6;
    // 1/ΔA = 4 + 0.008/[Q]: intercept 4, slope 0.008 M, K = 4/0.008 = 500 M⁻¹, ΔA∞ = 1/4.
    const fit = fitBenesiHildebrand([0, 0.001, 0.002, 0.004], [0, 1 / 12, 1 / 8, 1 / 6]);
    expectClose(fit.intercept.value, 4, 1e-12);
    expectClose(fit.slope.value, 0.008, 1e-12);
    expectClose(fit.kA.value, 500, 1e-12);
    expectClose(fit.limitingChange.value, 0.25, 1e-12);
  });

  it('when the data are noisy, then the line is simple-statistics linearRegression on 1/[Q], 1/ΔA', () => {
    const normal = seededNormal(21);
    const q = [0.002, 0.004, 0.006, 0.008, 0.012, 0.016, 0.02];
    const changes = q.map((c) => (0.15 * 150 * c) / (1 + 150 * c) + 0.002 * normal());
    const fit = fitBenesiHildebrand(q, changes);
    // Reference: simple-statistics linearRegression([[1/[Q], 1/ΔA], ...]) → { m, b }; K = b/m.
    const { m, b } = linearRegression(q.map((c, i) => [1 / c, 1 / changes[i]!]));
    expectClose(fit.kA.value, b / m, 1e-10);
    // SE by hand from the textbook line formulas: s² = SS/(n−2), var(b) = s²/Sxx, var(a) = s²(1/n + x̄²/Sxx),
    // cov(a, b) = −x̄ s²/Sxx; (SE_K/K)² = var(a)/a² + var(b)/b² − 2cov/(ab) (first-order propagation).
    const x = q.map((c) => 1 / c);
    const y = changes.map((d) => 1 / d);
    const n = x.length;
    const mean = x.reduce((s, v) => s + v, 0) / n;
    const sxx = x.reduce((s, v) => s + (v - mean) ** 2, 0);
    const ss = x.reduce((s, v, i) => s + (y[i]! - (b + m * v)) ** 2, 0);
    const s2 = ss / (n - 2);
    const k = b / m;
    const relative =
      (s2 * (1 / n + (mean * mean) / sxx)) / (b * b) + s2 / sxx / (m * m) - (2 * (-mean * s2)) / sxx / (b * m);
    expectClose(fit.kA.standardError, k * Math.sqrt(relative), 1e-8);
  });

  it("when the blank's error is given, then it adds (dK/dc σ0)² to the line's variance", () => {
    const q = [0.002, 0.004, 0.008, 0.016];
    const changes = [0.035, 0.055, 0.083, 0.1];
    const plain = fitBenesiHildebrand(q, changes);
    const withBlank = fitBenesiHildebrand(q, changes, 0.001);
    // Reference: K = b/m of simple-statistics linearRegression on 1/[Q], 1/(ΔA ± c), central difference in c.
    const kAt = (c: number) => {
      const { m, b } = linearRegression(q.map((value, i) => [1 / value, 1 / (changes[i]! + c)]));
      return b / m;
    };
    const slope = (kAt(1e-6) - kAt(-1e-6)) / 2e-6;
    expectClose(withBlank.kA.standardError ** 2, plain.kA.standardError ** 2 + (slope * 0.001) ** 2, 1e-5);
  });

  it('when the change has mixed signs or no saturation, then it refuses', () => {
    expect(() => fitBenesiHildebrand([0.001, 0.002, 0.004], [0.01, -0.01, 0.02])).toThrow(
      expect.objectContaining({ code: 'MODEL_NOT_APPLICABLE' }),
    );
    // ΔA rising faster than linear: 1/ΔA against 1/[Q] has a negative intercept.
    expect(() => fitBenesiHildebrand([0.001, 0.002, 0.004], [0.01, 0.03, 0.1])).toThrow(
      expect.objectContaining({ code: 'MODEL_NOT_APPLICABLE' }),
    );
  });
});

describe('fitBindingIsotherm', () => {
  it('when the data are exact, then K_a, the baseline and ΔA∞ come back (hand values above)', () => {
    const fit = fitBindingIsotherm({
      concentrations: [0, 0.001, 0.002, 0.004, 0.008],
      signals: [0.3, 0.3 + 1 / 12, 0.3 + 1 / 8, 0.3 + 1 / 6, 0.3 + 0.2],
    });
    expect(fit.form).toBe('excess');
    expectClose(fit.kA.value, 500, 1e-7);
    expectClose(fit.baseline.value, 0.3, 1e-8);
    expectClose(fit.limitingChange.value, 0.25, 1e-7);
  });

  it('when the data are noisy, then K_a matches ml-levenberg-marquardt and the SE the Jacobian by finite differences', () => {
    const e0 = 5e-5;
    const q = [0, 1e-5, 2e-5, 4e-5, 6e-5, 1e-4, 1.5e-4, 2e-4];
    const normal = seededNormal(5);
    const signals = q.map((c) => 0.2 + (0.12 * complex(e0, c, 2e4)) / e0 + 0.002 * normal());
    const fit = fitBindingIsotherm({ concentrations: q, signals, emitterConcentration: e0 });
    const model =
      ([y0, change, k]: number[]) =>
      (c: number) =>
        y0! + (change! * complex(e0, c, k!)) / e0;
    // Reference: ml-levenberg-marquardt 5.1.0 on the same model, parameters (y0, ΔA∞, K/10⁴) for scale.
    const reference = levenbergMarquardt(
      { x: q, y: signals },
      ([y0, change, k]: number[]) => model([y0!, change!, k! * 1e4]),
      {
        initialValues: [0.2, 0.1, 1],
        damping: 1e-3,
        gradientDifference: 1e-7,
        maxIterations: 200,
        errorTolerance: 1e-14,
      },
    );
    expectClose(fit.kA.value, reference.parameterValues[2]! * 1e4, 1e-4);
    // SE: s² (JᵀJ)⁻¹ with J by central differences (ml-matrix inverse), the textbook covariance of a nonlinear fit.
    const p = [fit.baseline.value, fit.limitingChange.value, fit.kA.value];
    const steps = p.map((value) => Math.abs(value) * 1e-6);
    const jacobian = q.map((c) =>
      p.map((_, j) => {
        const up = [...p];
        const down = [...p];
        up[j]! += steps[j]!;
        down[j]! -= steps[j]!;
        return (model(up)(c) - model(down)(c)) / (2 * steps[j]!);
      }),
    );
    const j = new Matrix(jacobian);
    const covariance = inverse(j.transpose().mmul(j));
    const s2 = fit.residualSumOfSquares / (q.length - 3);
    expectClose(fit.kA.standardError, Math.sqrt(s2 * covariance.get(2, 2)), 1e-4);
    expectClose(fit.limitingChange.standardError, Math.sqrt(s2 * covariance.get(1, 1)), 1e-4);
  });

  it('when the change is linear in [Q], then no K_a shows and it says so', () => {
    expect(() =>
      fitBindingIsotherm({ concentrations: [0, 0.001, 0.002, 0.003, 0.004], signals: [0, 0.01, 0.02, 0.03, 0.04] }),
    ).toThrow(/grows in proportion to \[Q\]/);
  });
});

describe('compareAssociationConstants', () => {
  it('when the difference is within 1.96 combined SEs, then they agree (hand values)', () => {
    // By hand: (120 − 110)/√(6² + 8²) = 1; (150 − 110)/10 = 4.
    const estimate = (value: number, standardError: number) => ({
      value,
      standardError,
      interval95: { lower: value, upper: value },
    });
    const near = compareAssociationConstants(estimate(120, 6), estimate(110, 8));
    expectClose(near.z, 1, 1e-12);
    expect(near.agree).toBe(true);
    const far = compareAssociationConstants(estimate(150, 6), estimate(110, 8));
    expectClose(far.z, 4, 1e-12);
    expect(far.agree).toBe(false);
  });
});

describe('normalUpperQuantile and secondDifferenceNoise', () => {
  it('when p is 0.025 or 0.005, then z is the table value', () => {
    // NIST/SEMATECH e-Handbook 1.3.6.7.1 (normal critical values): 1.960 and 2.576; more digits from memory.
    expectClose(normalUpperQuantile(0.025), 1.959963984540054, 1e-10);
    expectClose(normalUpperQuantile(0.005), 2.5758293035489, 1e-10);
  });
  it('when the readings alternate ±1, then σ = 1.4826 · 4 / √6 (hand calculation)', () => {
    // every second difference is ±4
    expectClose(secondDifferenceNoise([1, -1, 1, -1, 1, -1]), (1.4826 * 4) / Math.sqrt(6), 1e-12);
    expect(secondDifferenceNoise([1, 2, 3, 4, 5])).toBe(0);
  });
});
