import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitStudy } from '@shared/engine';
import { fitPoint, fitSettings } from './support/study-fit-fixture';

/*
 * A lifetime-only series, as a decay set applied to a study without intensities leaves it:
 * tau = tau0 / (1 + K_SV [Q]) with tau0 = 1 µs and K_SV = 500 M^-1 (Stern–Volmer for lifetimes,
 * Lakowicz 3rd ed. eq. 8.2; the numbers constructed, so K_SV = 500 and kq = K_SV/tau0 = 5e8
 * M^-1 s^-1 by hand).
 */
const concentrations = [0, 1e-3, 2e-3, 3e-3, 4e-3];
const lifetimeOnly = concentrations.map((q, i) => fitPoint(i, q, null, { lifetime: 1e-6 / (1 + 500 * q) }));

describe('fitStudy with lifetimes and no intensities', () => {
  it('when the series holds only lifetimes, then the intensity fit is "no intensity data" and K_SV and kq come from tau0/tau', () => {
    const fit = fitStudy(fitSettings(), lifetimeOnly, 'linear-free');
    expect(fit.result.intensity).toBe('no-intensity-data');
    expect(fit.kSv).toBeCloseTo(500, 6);
    expect(fit.kq).toBeCloseTo(5e8, -1);
    expect(fit.result.reference).toMatchObject({ kind: 'lifetime-tau0', value: 1e-6 });
    expect(fit.result.tau0).toMatchObject({ value: 1e-6, kind: 'lifetime-series' });
    expect(fit.result.lifetime!.kSv.value).toBeCloseTo(500, 6);
    expect(fit.result.plot.yLabel).toBe('τ0/τ');
    expect(fit.result.notes[0]).toMatch(/^No intensity data: K_SV and kq come from the lifetime Stern–Volmer fit/);
    expect(fit.pointsUsed.map((p) => p.position)).toEqual([0, 1, 2, 3, 4]);
  });

  it('when the lifetimes scatter, then K_SV and its intercept equal simple-statistics linearRegression on (Q, tau0/tau)', () => {
    const scatter = [0, 0.01, -0.008, 0.012, -0.006];
    const noisy = concentrations.map((q, i) => fitPoint(i, q, null, { lifetime: 1e-6 / (1 + 500 * q + scatter[i]!) }));
    const fit = fitStudy(fitSettings(), noisy, 'linear-free');
    const reference = linearRegression(fit.pointsUsed.map((p) => [p.concentration, p.ratio])); // simple-statistics 7.x
    expect(fit.kSv).toBeCloseTo(reference.m, 8);
    expect(fit.result.parameters.intercept!.value).toBeCloseTo(reference.b, 10);
  });

  it('when the fixed-line model is chosen, then the lifetime line goes through 1 and a left-out lifetime is drawn where it lies', () => {
    const withOutlier = [...lifetimeOnly, fitPoint(5, 5e-3, null, { lifetime: 1e-7, excluded: true })];
    const fit = fitStudy(fitSettings(), withOutlier, 'linear-fixed');
    expect(fit.result.parameters.intercept).toBeUndefined();
    expect(fit.kSv).toBeCloseTo(500, 6);
    // tau0/tau = 1e-6 / 1e-7 = 10 at 5 mM (hand-computed)
    expect(fit.result.plot.excluded).toEqual([{ position: 5, x: 5e-3, y: expect.closeTo(10, 10) }]);
  });

  it('when the combined model is chosen, then the lifetime line is fitted and a note says the model needs intensities', () => {
    const fit = fitStudy(fitSettings(), lifetimeOnly, 'static-dynamic');
    expect(fit.kSv).toBeCloseTo(500, 6);
    expect(fit.result.notes).toContain(
      'The combined static and dynamic model needs intensities; with lifetimes only, the line τ0/τ is fitted.',
    );
  });

  it('when fewer than three points carry a lifetime, then the engine refuses and says so', () => {
    expect(() => fitStudy(fitSettings(), lifetimeOnly.slice(0, 2), 'linear-free')).toThrow(
      /lifetimes: there are no intensities, and the lifetimes cannot be fitted either/,
    );
  });

  it('when intensities are there but no blank nor I0, then the intensity fit still refuses with MISSING_I0', () => {
    const both = concentrations
      .slice(1)
      .map((q, i) => fitPoint(i, q, 1000 / (1 + 500 * q), { lifetime: 1e-6 / (1 + 500 * q) }));
    expect(() => fitStudy(fitSettings({ tau0: 1e-6 }), both, 'linear-free')).toThrow(/i0: there is no point at zero/);
  });
});
