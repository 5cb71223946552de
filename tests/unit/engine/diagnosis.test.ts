import { describe, expect, it } from 'vitest';
import {
  compareStaticDynamic,
  EngineError,
  fitIntensitySternVolmer,
  fitLifetimeSternVolmer,
  fitModifiedSternVolmer,
  fitStaticDynamic,
  fitSternVolmer,
} from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal } from './support/seeded-random';

// Synthetic series with invented constants and seeded 0.5 % noise. Models from Lakowicz,
// Principles of Fluorescence Spectroscopy, 3rd ed. (2006), ch. 8:
// linear I0/I = 1 + K[Q]; combined (1 + K_D[Q])(1 + K_S[Q]); Lehrer (1971) partial access
// I/I0 = (1 - f_a) + f_a / (1 + K[Q]).
const q = [0, 0, 2e-3, 4e-3, 6e-3, 8e-3, 10e-3, 12e-3, 14e-3, 16e-3, 18e-3, 20e-3];
const linear = (kSv: number) => (c: number) => 1 / (1 + kSv * c);
const combined = (kD: number, kS: number) => (c: number) => 1 / ((1 + kD * c) * (1 + kS * c));
const partial = (fa: number, k: number) => (c: number) => 1 - fa + fa / (1 + k * c);

function intensities(relative: (c: number) => number, seed: number, noise = 0.005): number[] {
  const normal = seededNormal(seed);
  return q.map((c) => 1e4 * relative(c) * (1 + noise * normal()));
}

describe('curvature diagnosis', () => {
  it('classifies 20 seeded linear sets as linear in at least 18 (5 % false-alarm level)', () => {
    let linearCount = 0;
    for (let seed = 1; seed <= 20; seed++) {
      const fit = fitIntensitySternVolmer({ concentrations: q, intensities: intensities(linear(100), seed) });
      if (fit.diagnosis.shape === 'linear') linearCount++;
    }
    expect(linearCount).toBeGreaterThanOrEqual(18);
  });

  it('classifies static + dynamic data as upward and flags it', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const fit = fitIntensitySternVolmer({ concentrations: q, intensities: intensities(combined(60, 25), seed) });
      expect(fit.diagnosis.shape).toBe('upward');
      expect(fit.diagnosis.fTest!.pValue).toBeLessThan(0.05);
      expect(fit.flags.map((flag) => flag.code)).toContain('UPWARD_CURVATURE');
    }
  });

  it('classifies partly accessible emitters as downward and flags it', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const fit = fitIntensitySternVolmer({ concentrations: q, intensities: intensities(partial(0.6, 300), seed) });
      expect(fit.diagnosis.shape).toBe('downward');
      expect(fit.flags.map((flag) => flag.code)).toContain('DOWNWARD_CURVATURE');
    }
  });

  it('runs test sees few runs in the residuals of a curved set', () => {
    const exact = fitSternVolmer({ concentrations: q, ratios: q.map((c) => 1 / combined(60, 25)(c)) });
    expect(exact.diagnosis.runs.runs).toBeLessThanOrEqual(3); // +, -, + pattern of a line through a convex curve
    expect(exact.diagnosis.runs.pValue).toBeLessThan(0.05);
  });
});

describe('combined static and dynamic model', () => {
  it('recovers K_D = 60 and K_S = 25 M^-1 within 10 % and assigns them with lifetime data', () => {
    const measured = intensities(combined(60, 25), 21, 0.002);
    const i0 = (measured[0]! + measured[1]!) / 2;
    const ratios = measured.map((value) => i0 / value);
    const fit = fitStaticDynamic({ concentrations: q, ratios, lifetimeSlope: 58 });
    expect(Math.abs(fit.largerRoot.value - 60) / 60).toBeLessThan(0.1);
    expect(Math.abs(fit.smallerRoot.value - 25) / 25).toBeLessThan(0.1);
    // and the propagated standard errors are honest: both within 3 SE of the truth
    expect(Math.abs(fit.largerRoot.value - 60)).toBeLessThan(3 * fit.largerRoot.standardError);
    expect(Math.abs(fit.smallerRoot.value - 25)).toBeLessThan(3 * fit.smallerRoot.standardError);
    expect(fit.assignment.kind).toBe('resolved');
    if (fit.assignment.kind === 'resolved') {
      expect(fit.assignment.kD.value).toBe(fit.largerRoot.value);
      expect(fit.assignment.rule).toBe('closest-to-lifetime-slope');
    }
    // Vieta: roots sum to b1 and multiply to b2 (published identity)
    expectClose(fit.largerRoot.value + fit.smallerRoot.value, fit.sum.value, 1e-12);
    expectClose(fit.largerRoot.value * fit.smallerRoot.value, fit.product.value, 1e-9);
  });

  it('reports the assignment as ambiguous without lifetime data, and uses the diffusion bound when given', () => {
    const ratios = q.map((c) => 1 / combined(60, 25)(c));
    expect(fitStaticDynamic({ concentrations: q, ratios }).assignment.kind).toBe('ambiguous');
    const bounded = fitStaticDynamic({ concentrations: q, ratios, maxDynamicConstant: 40 });
    expect(bounded.assignment.kind === 'resolved' && bounded.assignment.kD.value).toBeCloseTo(25, 8);
  });

  it('refuses downward-curving data with a typed error', () => {
    const ratios = q.map((c) => 1 / partial(0.6, 300)(c));
    expect(() => fitStaticDynamic({ concentrations: q, ratios })).toThrowError(EngineError);
    expect(() => fitStaticDynamic({ concentrations: q, ratios })).toThrowError(/modified Stern–Volmer/);
  });
});

describe('modified Stern–Volmer (Lehrer 1971)', () => {
  it('recovers f_a = 0.6 and K = 300 M^-1 within 5 % from seeded data', () => {
    const fit = fitModifiedSternVolmer({ concentrations: q, intensities: intensities(partial(0.6, 300), 8, 0.002) });
    expect(Math.abs(fit.accessibleFraction.value - 0.6) / 0.6).toBeLessThan(0.05);
    expect(Math.abs(fit.kSv.value - 300) / 300).toBeLessThan(0.05);
    expect(fit.n).toBe(q.length - 2); // blanks only supply I0
  });

  it('is exact on noise-free data: intercept 1/f_a, slope 1/(f_a K)', () => {
    const fit = fitModifiedSternVolmer({ concentrations: q, intensities: q.map((c) => 1e4 * partial(0.75, 1000)(c)) });
    expectClose(fit.accessibleFraction.value, 0.75, 1e-10);
    expectClose(fit.kSv.value, 1000, 1e-9);
    expectClose(fit.line.intercept.value, 1 / 0.75, 1e-10);
  });
});

describe('static versus dynamic from intensity and lifetime slopes', () => {
  const tau0 = 1e-6;
  const lifetimes = (kD: number, seed: number) => {
    const normal = seededNormal(seed);
    return q.map((c) => (tau0 / (1 + kD * c)) * (1 + 0.003 * normal()));
  };

  it('equal slopes within error: dynamic', () => {
    const intensity = fitIntensitySternVolmer({
      concentrations: q,
      intensities: intensities(linear(80), 31, 0.003),
      intercept: 'fixed-at-one',
    });
    const lifetime = fitLifetimeSternVolmer({
      concentrations: q,
      lifetimes: lifetimes(80, 32),
      intercept: 'fixed-at-one',
    });
    const result = compareStaticDynamic(intensity, lifetime);
    expect(result.verdict).toBe('dynamic');
    expect(result.staticConstant!.interval95.lower).toBeLessThan(0);
  });

  it('steeper intensity plot: static contribution, K_S from (I0/I)/(tau0/tau) = 1 + K_S[Q]', () => {
    // I0/I = (1 + 40[Q])(1 + 15[Q]) with tau0/tau = 1 + 40[Q]: the ratio of ratios is 1 + 15[Q].
    const intensity = fitIntensitySternVolmer({
      concentrations: q,
      intensities: intensities(combined(40, 15), 33, 0.002),
      intercept: 'fixed-at-one',
    });
    const lifetime = fitLifetimeSternVolmer({
      concentrations: q,
      lifetimes: lifetimes(40, 34),
      intercept: 'fixed-at-one',
    });
    const result = compareStaticDynamic(intensity, lifetime);
    expect(result.verdict).toBe('static-contribution');
    expect(Math.abs(result.staticConstant!.value - 15) / 15).toBeLessThan(0.1);
  });

  it('lifetime plot steeper than intensity: flagged as a data problem', () => {
    const intensity = fitSternVolmer({
      concentrations: q,
      ratios: q.map((c) => 1 + 30 * c + 1e-3 * Math.sin(c * 1e3)),
    });
    const lifetime = fitSternVolmer({ concentrations: q, ratios: q.map((c) => 1 + 60 * c + 1e-3 * Math.cos(c * 1e3)) });
    const result = compareStaticDynamic(intensity, lifetime);
    expect(result.verdict).toBe('lifetime-steeper');
    expect(result.flags[0]!.code).toBe('LIFETIME_STEEPER_THAN_INTENSITY');
  });
});
