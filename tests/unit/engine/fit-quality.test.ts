import { describe, expect, it } from 'vitest';
import { linearRegression, rSquared } from 'simple-statistics';
import { fitSternVolmer, QUALITY_FLAG_CODES, qualityFlag, screenSeries } from '@shared/engine';
import { qualityFlagSchema } from '@shared/schemas/quality-flag';
import { expectClose } from './support/expect-close';

const codes = (flags: Array<{ code: string }>) => flags.map((flag) => flag.code);

describe('R² of a line through 1 (intercept fixed)', () => {
  // An upward-curved series: (1 + 30 [Q])(1 + 20 [Q]) at 0..50 mM (invented test data, exact).
  const concentrations = [0, 0.01, 0.02, 0.03, 0.04, 0.05];
  const ratios = concentrations.map((q) => (1 + 30 * q) * (1 + 20 * q));

  it('when the intercept is fixed, then both the uncentred R² and the centred R² of the same line are given', () => {
    const fit = fitSternVolmer({ concentrations, ratios, intercept: 'fixed-at-one' });
    const k = fit.kSv.value;
    const residualSS = ratios.reduce((sum, y, i) => sum + (y - 1 - k * concentrations[i]!) ** 2, 0);
    // Uncentred, by hand: 1 - SS_res / sum (y - 1)^2 (regression through the origin of y - 1).
    const uncentred = 1 - residualSS / ratios.reduce((sum, y) => sum + (y - 1) ** 2, 0);
    // Centred R² of the very same line: simple-statistics rSquared(points, f), 1 - SS_res / sum (y - mean y)^2.
    const centred = rSquared(
      concentrations.map((q, i) => [q, ratios[i]!]),
      (q) => 1 + k * q,
    );
    expect(fit.rSquaredDefinition).toBe('uncentred');
    expectClose(fit.rSquared, uncentred, 1e-12);
    expectClose(fit.rSquaredCentred, centred, 1e-12);
    // On a curved series the fixed line looks better uncentred than it is.
    expect(fit.rSquaredCentred).toBeLessThan(fit.rSquared);
  });

  it('when the intercept is free, then the centred R² is the R² itself', () => {
    const fit = fitSternVolmer({ concentrations, ratios });
    const line = linearRegression(concentrations.map((q, i) => [q, ratios[i]!]));
    // simple-statistics rSquared with its own least-squares line
    const reference = rSquared(
      concentrations.map((q, i) => [q, ratios[i]!]),
      (q) => line.b + line.m * q,
    );
    expectClose(fit.rSquaredCentred, reference, 1e-12);
    expect(fit.rSquaredCentred).toBe(fit.rSquared);
  });
});

describe('quality flags on a poor series', () => {
  it('when R² is below 0.98 and K_SV is uncertain by more than 10 %, then both are flagged with what to do', () => {
    // Invented scatter around 1 + 100 [Q].
    const concentrations = [0, 0.002, 0.004, 0.006, 0.008, 0.01];
    const ratios = [1.0, 1.35, 1.1, 1.7, 1.5, 2.2];
    const fit = fitSternVolmer({ concentrations, ratios });
    const points = concentrations.map((q, i) => [q, ratios[i]!]);
    const line = linearRegression(points);
    // simple-statistics: R² of the least-squares line; relative SE by hand, sqrt(SS_res/(n - 2)/Sxx)/slope.
    const r2 = rSquared(points, (q) => line.b + line.m * q);
    const mean = concentrations.reduce((a, b) => a + b, 0) / concentrations.length;
    const sxx = concentrations.reduce((sum, q) => sum + (q - mean) ** 2, 0);
    const ssRes = points.reduce((sum, [q, y]) => sum + (y! - line.b - line.m * q!) ** 2, 0);
    const relativeSe = Math.sqrt(ssRes / (concentrations.length - 2) / sxx) / line.m;
    expect(r2).toBeLessThan(0.98);
    expect(relativeSe).toBeGreaterThan(0.1);
    expect(codes(fit.flags)).toContain('LOW_R_SQUARED');
    expect(codes(fit.flags)).toContain('KSV_UNCERTAIN');
    const low = fit.flags.find((flag) => flag.code === 'LOW_R_SQUARED')!;
    expect(low.detail).toContain(r2.toFixed(3));
    expect(low.whatToDo.length).toBeGreaterThan(20);
    const uncertain = fit.flags.find((flag) => flag.code === 'KSV_UNCERTAIN')!;
    expect(uncertain.detail).toContain(`${(relativeSe * 100).toFixed(0)} %`);
  });

  it('when a ratio lies below 1 by more than its uncertainty, then it is flagged; within its uncertainty it is not', () => {
    const concentrations = [0, 0.002, 0.004, 0.006, 0.008, 0.01];
    const ratios = [1.0, 0.95, 1.4, 1.6, 1.8, 2.0];
    // point 2: 0.95 + 0.01 < 1, flagged; the blank 1.0 is not below 1.
    const flagged = fitSternVolmer({
      concentrations,
      ratios,
      ratioUncertainties: [0.01, 0.01, 0.02, 0.02, 0.02, 0.02],
    });
    const below = flagged.flags.find((flag) => flag.code === 'RATIO_BELOW_ONE');
    expect(below?.detail).toContain('point 2');
    // 0.95 with an uncertainty of 0.08 reaches 1: no flag.
    const within = fitSternVolmer({ concentrations, ratios, ratioUncertainties: [0.01, 0.08, 0.02, 0.02, 0.02, 0.02] });
    expect(codes(within.flags)).not.toContain('RATIO_BELOW_ONE');
  });

  it('when the free intercept is more than 3 standard errors from 1, then it is flagged, even when close to 1 in value', () => {
    // Exact line 1.04 + 500 [Q] with a small alternating scatter: the intercept 1.04 lies many SE from 1.
    const concentrations = [0, 0.002, 0.004, 0.006, 0.008, 0.01];
    const ratios = concentrations.map((q, i) => 1.04 + 500 * q + (i % 2 ? 0.002 : -0.002));
    const fit = fitSternVolmer({ concentrations, ratios });
    const { value, standardError } = fit.fittedIntercept!;
    expect(Math.abs(value - 1) / standardError).toBeGreaterThan(3);
    expect(codes(fit.flags)).toContain('INTERCEPT_FAR_FROM_ONE');
    // An intercept 2 SE from 1 is not flagged.
    const near = fitSternVolmer({
      concentrations,
      ratios: concentrations.map((q, i) => 1 + 2 * standardError + 500 * q + (i % 2 ? 0.002 : -0.002)),
    });
    expect(codes(near.flags)).not.toContain('INTERCEPT_FAR_FROM_ONE');
  });

  it('when the quencher absorbs at the excitation wavelength and the inner-filter correction is off, then it says to switch it on', () => {
    const screen = screenSeries({
      concentrations: [0, 1e-3, 2e-3, 3e-3, 4e-3],
      intensities: [100, 90, 80, 70, 60],
      absorbancesExcitation: [0, 0.01, 0.02, 0.03, 0.04],
      innerFilterCorrection: false,
    });
    const flag = screen.flags.find((entry) => entry.code === 'QUENCHER_ABSORBS_UNCORRECTED');
    expect(flag?.detail).toContain('A_ex up to 0.04');
    expect(flag?.whatToDo).toMatch(/inner-filter correction/);
    const corrected = screenSeries({
      concentrations: [0, 1e-3, 2e-3, 3e-3, 4e-3],
      intensities: [100, 90, 80, 70, 60],
      absorbancesExcitation: [0, 0.01, 0.02, 0.03, 0.04],
      innerFilterCorrection: true,
    });
    expect(codes(corrected.flags)).not.toContain('QUENCHER_ABSORBS_UNCORRECTED');
  });

  it('when any flag is made, then it says what to do and fits the shared schema', () => {
    for (const code of QUALITY_FLAG_CODES) {
      const flag = qualityFlag(code);
      expect(flag.whatToDo.length, code).toBeGreaterThan(10);
      expect(qualityFlagSchema.parse(flag).whatToDo).toBe(flag.whatToDo);
    }
  });
});
