import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { EngineError, fitIntensitySternVolmer, fitLifetimeSternVolmer, fitSternVolmer } from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal } from './support/seeded-random';

// Synthetic data: invented parameters, seeded noise. The law generating them is
// Stern–Volmer, I0/I = 1 + K_SV[Q] (Stern & Volmer 1919; IUPAC Gold Book S06004).
const concentrations = [0, 0, 0.5e-3, 1e-3, 1.5e-3, 2e-3, 3e-3, 4e-3, 5e-3, 6e-3];

function noisyIntensities(kSv: number, i0: number, relativeNoise: number, seed: number): number[] {
  const normal = seededNormal(seed);
  return concentrations.map((q) => (i0 / (1 + kSv * q)) * (1 + relativeNoise * normal()));
}

describe('fitIntensitySternVolmer', () => {
  it('95 % intervals cover the true K_SV in >= 90 % of 200 seeded series (weighted, I0 known)', () => {
    // A correct interval covers ~95 %; binomial sd at n = 200 is 1.5 %, so 90 % is > 3 sd below.
    let covered = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const intensities = noisyIntensities(350, 1e5, 0.01, seed);
      const fit = fitIntensitySternVolmer({
        concentrations,
        intensities,
        intensityUncertainties: intensities.map((value) => 0.01 * value),
        i0: 1e5,
      });
      if (fit.kSv.interval95.lower <= 350 && 350 <= fit.kSv.interval95.upper) covered++;
      expect(Math.abs(fit.kSv.value - 350) / 350).toBeLessThan(0.05);
    }
    expect(covered).toBeGreaterThanOrEqual(180);
  });

  it('95 % intervals cover the true K_SV in >= 90 % of 200 series with constant ratio noise', () => {
    let covered = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const normal = seededNormal(seed + 1000);
      const fit = fitSternVolmer({ concentrations, ratios: concentrations.map((q) => 1 + 350 * q + 0.02 * normal()) });
      if (fit.kSv.interval95.lower <= 350 && 350 <= fit.kSv.interval95.upper) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(180);
  });

  it('adds the uncertainty of an I0 averaged from blanks to the K_SV standard error', () => {
    // First-order propagation: every ratio shares I0, so SE^2 = SE_fit^2 + (K_SV * SE(I0)/I0)^2.
    const intensities = noisyIntensities(350, 1e5, 0.01, 5);
    const fit = fitIntensitySternVolmer({ concentrations, intensities });
    const fitOnly = fitSternVolmer({ concentrations, ratios: intensities.map((value) => fit.i0.value / value) });
    const blankSpread = Math.abs(intensities[0]! - intensities[1]!) / Math.SQRT2; // sd of two values
    const relativeI0 = blankSpread / Math.SQRT2 / fit.i0.value;
    expectClose(fit.i0.relativeStandardError!, relativeI0, 1e-12);
    expectClose(fit.kSv.standardError, Math.hypot(fitOnly.kSv.standardError, fitOnly.kSv.value * relativeI0), 1e-12);
  });

  it('takes I0 as the mean of the zero-concentration replicates, or the given value', () => {
    const intensities = noisyIntensities(200, 5000, 0.005, 3);
    const fit = fitIntensitySternVolmer({ concentrations, intensities });
    expect(fit.i0).toMatchObject({
      value: (intensities[0]! + intensities[1]!) / 2,
      source: 'mean-of-zero-concentration-points',
      replicates: 2,
    });
    const given = fitIntensitySternVolmer({ concentrations, intensities, i0: 5000 });
    expect(given.i0.source).toBe('given');
    expectClose(given.points.ratios[3]!, 5000 / intensities[3]!, 1e-15);
  });

  it('fixed intercept regresses I0/I - 1 through the origin and reports uncentred R^2', () => {
    const exact = concentrations.map((q) => 1 + 420 * q);
    const fit = fitSternVolmer({ concentrations, ratios: exact, intercept: 'fixed-at-one' });
    expectClose(fit.kSv.value, 420, 1e-12);
    expect(fit.fittedIntercept).toBeNull();
    expect(fit.rSquaredDefinition).toBe('uncentred');
    expect(fit.degreesOfFreedom).toBe(concentrations.length - 1);
  });

  it('weights from intensity uncertainties: a noisy point with a large sigma barely moves K_SV', () => {
    const intensities = concentrations.map((q) => 1000 / (1 + 300 * q));
    intensities[9] = intensities[9]! * 0.8; // a bad last point
    const sigmas = intensities.map((_, i) => (i === 9 ? 1000 : 1));
    const unweighted = fitIntensitySternVolmer({ concentrations, intensities });
    const weighted = fitIntensitySternVolmer({ concentrations, intensities, intensityUncertainties: sigmas });
    expect(weighted.weighted).toBe(true);
    expect(Math.abs(weighted.kSv.value - 300)).toBeLessThan(Math.abs(unweighted.kSv.value - 300) / 100);
  });

  it('flags fewer than five distinct concentrations and an intercept far from 1', () => {
    const q = [0, 1e-3, 1e-3, 2e-3, 3e-3];
    const fit = fitSternVolmer({ concentrations: q, ratios: [1.2, 1.71, 1.69, 2.2, 2.7] });
    expect(fit.distinctConcentrations).toBe(4);
    expect(fit.flags.map((flag) => flag.code)).toEqual(['FEW_CONCENTRATIONS', 'INTERCEPT_FAR_FROM_ONE']);
    expect(fit.flags[1]!.whatToCheck.length).toBeGreaterThan(0);
  });
});

describe('fitLifetimeSternVolmer', () => {
  it('recovers kq tau0 from tau0/tau and reports tau0 (s)', () => {
    const tau0 = 1.1e-6;
    const kq = 2e9;
    const normal = seededNormal(11);
    const lifetimes = concentrations.map((q) => (tau0 / (1 + kq * tau0 * q)) * (1 + 0.005 * normal()));
    const fit = fitLifetimeSternVolmer({ concentrations, lifetimes, intercept: 'fixed-at-one' });
    expect(Math.abs(fit.kSv.value - kq * tau0) / (kq * tau0)).toBeLessThan(0.03);
    expect(fit.tau0.replicates).toBe(2);
  });
});

describe('Stern–Volmer properties (fast-check)', () => {
  const ratios = concentrations.map((q, i) => 1 + 250 * q + 0.01 * Math.sin(i * 1.7));

  it('point order does not change the fit or its diagnosis', () => {
    const reference = fitSternVolmer({ concentrations, ratios });
    fc.assert(
      fc.property(fc.shuffledSubarray([...concentrations.keys()], { minLength: concentrations.length }), (order) => {
        const fit = fitSternVolmer({
          concentrations: order.map((i) => concentrations[i]!),
          ratios: order.map((i) => ratios[i]!),
        });
        return (
          Math.abs(fit.kSv.value - reference.kSv.value) <= 1e-9 * reference.kSv.value &&
          Math.abs(fit.kSv.standardError - reference.kSv.standardError) <= 1e-6 * reference.kSv.standardError &&
          fit.diagnosis.runs.runs === reference.diagnosis.runs.runs &&
          fit.diagnosis.shape === reference.diagnosis.shape
        );
      }),
    );
  });

  it('scaling concentrations by c scales K_SV by 1/c', () => {
    const reference = fitSternVolmer({ concentrations, ratios });
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (c) => {
        const fit = fitSternVolmer({ concentrations: concentrations.map((q) => q * c), ratios });
        return Math.abs(fit.kSv.value * c - reference.kSv.value) <= 1e-9 * reference.kSv.value;
      }),
    );
  });
});

describe('Stern–Volmer bad input', () => {
  const expectEngineError = (run: () => unknown, code: string, message: RegExp) => {
    try {
      run();
      expect.fail('expected an EngineError');
    } catch (error) {
      expect(error).toBeInstanceOf(EngineError);
      expect((error as EngineError).code).toBe(code);
      expect((error as EngineError).message).toMatch(message);
    }
  };

  it('fewer than 3 distinct concentrations', () => {
    expectEngineError(
      () => fitSternVolmer({ concentrations: [0, 1e-3, 1e-3, 0], ratios: [1, 2, 2, 1] }),
      'TOO_FEW_CONCENTRATIONS',
      /^concentrations: only 2 distinct concentrations; at least 3 are needed\. /,
    );
  });

  it('NaN in intensities or concentrations', () => {
    expectEngineError(
      () => fitIntensitySternVolmer({ concentrations: [0, 1, 2], intensities: [1, Number.NaN, 3] }),
      'NON_FINITE_VALUE',
      /^intensities\[1\]: expected a finite number, got NaN/,
    );
    expectEngineError(
      () => fitSternVolmer({ concentrations: [0, Number.NaN, 2], ratios: [1, 2, 3] }),
      'NON_FINITE_VALUE',
      /^concentrations\[1\]/,
    );
  });

  it('negative concentration', () => {
    expectEngineError(
      () => fitSternVolmer({ concentrations: [0, -1e-3, 2e-3], ratios: [1, 2, 3] }),
      'NEGATIVE_VALUE',
      /^concentrations\[1\]: must not be negative/,
    );
  });

  it('zero or negative intensity', () => {
    expectEngineError(
      () => fitIntensitySternVolmer({ concentrations: [0, 1e-3, 2e-3], intensities: [100, 0, 40] }),
      'NON_POSITIVE_VALUE',
      /^intensities\[1\]: must be greater than zero, got 0\. A ratio I0\/I needs positive intensities/,
    );
    expectEngineError(
      () => fitIntensitySternVolmer({ concentrations: [0, 1e-3, 2e-3], intensities: [100, -5, 40] }),
      'NON_POSITIVE_VALUE',
      /got -5/,
    );
  });

  it('no I0: no zero point and none given', () => {
    expectEngineError(
      () => fitIntensitySternVolmer({ concentrations: [1e-3, 2e-3, 3e-3], intensities: [80, 60, 50] }),
      'MISSING_I0',
      /^i0: there is no point at zero quencher concentration/,
    );
    expectEngineError(
      () => fitLifetimeSternVolmer({ concentrations: [1e-3, 2e-3, 3e-3], lifetimes: [8e-7, 6e-7, 5e-7] }),
      'MISSING_TAU0',
      /^tau0:/,
    );
  });

  it('mismatched lengths', () => {
    expectEngineError(
      () => fitSternVolmer({ concentrations: [0, 1, 2], ratios: [1, 2] }),
      'LENGTH_MISMATCH',
      /^ratios: has 2 values but concentrations has 3/,
    );
  });
});
