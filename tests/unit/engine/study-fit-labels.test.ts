import { linearRegression, rSquared } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitStudy } from '@shared/engine';
import { expectClose } from './support/expect-close';
import { fitPoint, fitSettings } from './support/study-fit-fixture';

const settings = fitSettings();
const point = fitPoint;

// Invented series bending upward, (1 + 30 [Q])(1 + 20 [Q]), with three blanks that scatter.
const qs = [0, 0, 0, 0.01, 0.02, 0.03, 0.04, 0.05];
const blankScatter = [1010, 990, 1000];
const curved = qs.map((q, i) => point(i, q, i < 3 ? blankScatter[i]! : 1000 / ((1 + 30 * q) * (1 + 20 * q))));

describe('the stored result says what each number is', () => {
  it('when the line is fixed through 1, then the result carries the uncentred R² labelled as such and the centred R² of the same line', () => {
    const fit = fitStudy(settings, curved, 'linear-fixed');
    const { statistics } = fit.result;
    expect(statistics.rSquaredDefinition).toBe('uncentred');
    const k = fit.result.parameters.kSv!.value;
    const ratios = fit.pointsUsed.map((p) => p.ratio);
    // simple-statistics rSquared with the stored line 1 + K_SV [Q]: the centred R² of that line.
    const centred = rSquared(
      fit.pointsUsed.map((p) => [p.concentration, p.ratio]),
      (q) => 1 + k * q,
    );
    expectClose(statistics.rSquaredCentred!, centred, 1e-9);
    // uncentred by hand: 1 - SS_res / sum (ratio - 1)^2
    const ssRes = fit.pointsUsed.reduce((sum, p) => sum + (p.ratio - 1 - k * p.concentration) ** 2, 0);
    expectClose(statistics.rSquared!, 1 - ssRes / ratios.reduce((sum, r) => sum + (r - 1) ** 2, 0), 1e-9);
  });

  it('when I0 comes from three blanks, then the SE of K_SV says it includes I0 from 3 blanks', () => {
    const fit = fitStudy(settings, curved, 'linear-free');
    expect(fit.result.parameters.kSv!.includes).toMatch(/I0 from 3 blanks/);
    const entered = fitStudy({ ...settings, i0: 1000 }, curved.slice(3), 'linear-free');
    expect(entered.result.parameters.kSv!.includes).toMatch(/I0 entered, taken as exact/);
  });

  it('when τ0 comes from a single lifetime blank, then it is stored as without uncertainty and kq says its SE covers K_SV only', () => {
    const lifetimes = [1e-6, null, null, 0.8e-6, 0.7e-6, 0.6e-6, 0.55e-6, 0.5e-6];
    const pts = curved.map((p, i) => ({ ...p, lifetime: lifetimes[i]! }));
    const fit = fitStudy(settings, pts, 'linear-free');
    expect(fit.result.tau0).toMatchObject({ kind: 'lifetime-series', standardError: null });
    expect(fit.result.tau0!.source).toMatch(/without uncertainty/);
    expect(fit.result.parameters.kq!.includes).toMatch(/τ0 without uncertainty/);
  });

  it('when τ0 comes from a lifetime record with an SE, then kq says it includes that SE', () => {
    const fit = fitStudy(
      { ...settings, tau0: 1e-6, tau0Uncertainty: 0.05e-6, tau0LifetimeId: 'rec' },
      curved,
      'linear-free',
    );
    expect(fit.result.parameters.kq!.includes).toMatch(/τ0 from a lifetime record \(SE 50 ns\)/);
  });

  it('when lifetimes are measured, then kq from lifetimes is the slope of 1/τ against [Q] with its own SE (τ0 not counted twice)', () => {
    const lifetimes = [1.02e-6, 0.98e-6, 1.0e-6, 0.845e-6, 0.71e-6, 0.63e-6, 0.55e-6, 0.505e-6];
    const pts = curved.map((p, i) => ({ ...p, lifetime: lifetimes[i]! }));
    const fit = fitStudy(settings, pts, 'linear-free');
    // simple-statistics linearRegression on ([Q], 1/τ): slope = kq.
    const line = linearRegression(qs.map((q, i) => [q, 1 / lifetimes[i]!]));
    expectClose(fit.result.parameters.kqFromLifetimes!.value, line.m, 1e-9);
    expect(fit.result.parameters.kqFromLifetimes!.includes).toMatch(/slope of 1\/τ/);
  });

  it('when the intensity line is fixed through 1, then the lifetimes are fitted through 1 too before the two are compared', () => {
    const lifetimes = [1.02e-6, 0.98e-6, 1.0e-6, 0.845e-6, 0.71e-6, 0.63e-6, 0.55e-6, 0.505e-6];
    const pts = curved.map((p, i) => ({ ...p, lifetime: lifetimes[i]! }));
    const fixed = fitStudy(settings, pts, 'linear-fixed');
    const free = fitStudy(settings, pts, 'linear-free');
    expect(fixed.result.lifetime!.intercept).toBe('fixed-at-one');
    expect(free.result.lifetime!.intercept).toBe('free');
    expect(fixed.result.lifetime!.kSv.value).not.toBeCloseTo(free.result.lifetime!.kSv.value, 3);
  });

  it('when the quencher absorbs at the excitation wavelength and the correction is off, then the fit is flagged', () => {
    const pts = curved.map((p, i) => ({ ...p, absorbanceExcitation: 0.01 * i }));
    const fit = fitStudy(settings, pts, 'linear-free');
    expect(fit.result.flags.map((flag) => flag.code)).toContain('QUENCHER_ABSORBS_UNCORRECTED');
  });
});
