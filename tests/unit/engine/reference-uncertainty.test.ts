import { describe, expect, it } from 'vitest';
import { fitIntensitySternVolmer, fitLifetimeSternVolmer } from '@shared/engine';

// The part of SE(K_SV) that comes from the blanks' I0 (issue 13, finding 2; item 6 of its last note).
//
// Hand derivation. Every ratio is y_i = I0 / I_i, so ∂y_i/∂I0 = y_i / I0 and the weights (1/σ² of
// y_i, σ = y_i σ_I / I_i) all scale by the same factor 1/I0², which cancels from both slopes below.
// - Intercept fixed at 1 (y − 1 = K q through the origin): K = Σ w q (y − 1) / Σ w q², so
//     dK/dI0 = Σ w q (∂y/∂I0) / Σ w q² = Σ w q y / (I0 Σ w q²),
//   i.e. dK/d ln I0 = Σ w q y / Σ w q² = K + Σ w q / Σ w q²: larger than K, because the "1" the
//   line is pinned to does not scale with I0.
// - Intercept free: K = Σ w (q − q̄)(y − ȳ) / Σ w (q − q̄)² is linear in y, and every y scales with
//   I0, so dK/d ln I0 = K exactly.
// First-order propagation (Bevington & Robinson, Data Reduction and Error Analysis, 3rd ed., ch. 3):
//   SE² = SE_fit² + (dK/dI0 · SE(I0))², SE(I0) = I0 × the blanks' relative standard error.
//
// The check is outside the propagation code: dK/dI0 is taken as a central finite difference of the
// engine's own K with I0 entered at I0(1 ± h), and SE_fit is the engine's SE with I0 entered
// (taken as exact). Invented intensities; the numbers checked come from the derivative, not from them.
const concentrations = [0, 0, 0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3, 6e-3];
const intensities = [1012, 995, 1003, 640, 470, 372, 300, 256, 219];
const sigmas = intensities.map((value) => 0.01 * value + 2);
const blanks = intensities.slice(0, 3);
const i0 = blanks.reduce((sum, value) => sum + value, 0) / blanks.length;
// sample SD over √n, as a fraction of the mean (the SE of a mean, common practice)
const relativeSe =
  Math.sqrt(blanks.reduce((sum, value) => sum + (value - i0) ** 2, 0) / (blanks.length - 1) / blanks.length) / i0;

type Fit = typeof fitIntensitySternVolmer;
const cases: Array<{ name: string; fit: (i0?: number) => ReturnType<Fit> }> = [];
for (const intercept of ['fixed-at-one', 'free'] as const) {
  cases.push({
    name: `intensities, ${intercept}, unweighted`,
    fit: (given) =>
      fitIntensitySternVolmer({ concentrations, intensities, intercept, ...(given ? { i0: given } : {}) }),
  });
  cases.push({
    name: `intensities, ${intercept}, weighted by each σ`,
    fit: (given) =>
      fitIntensitySternVolmer({
        concentrations,
        intensities,
        intensityUncertainties: sigmas,
        intercept,
        ...(given ? { i0: given } : {}),
      }),
  });
}

describe('SE of K_SV from the blanks’ I0', () => {
  it.each(cases)('when $name, then the I0 part is dK/dI0 × SE(I0) with dK/dI0 from a finite difference', ({ fit }) => {
    const h = 1e-6;
    const derivative = (fit(i0 * (1 + h)).kSv.value - fit(i0 * (1 - h)).kSv.value) / (2 * h * i0);
    const own = fit(i0).kSv.standardError;
    const expected = Math.hypot(own, derivative * i0 * relativeSe);
    const fromBlanks = fit();
    expect(fromBlanks.i0.replicates).toBe(3);
    expect(fromBlanks.kSv.value).toBeCloseTo(fit(i0).kSv.value, 9);
    // finite difference with h = 1e-6 of a smooth function: about 1e-8 relative (common practice)
    expect(Math.abs(fromBlanks.kSv.standardError - expected) / expected).toBeLessThan(1e-6);
  });

  it('when the intercept is fixed, then dK/d ln I0 is K + Σwq/Σwq² (the hand form above), not K', () => {
    const fixed = fitIntensitySternVolmer({ concentrations, intensities, intercept: 'fixed-at-one', i0 });
    const sumQ = concentrations.reduce((sum, q) => sum + q, 0);
    const sumQ2 = concentrations.reduce((sum, q) => sum + q * q, 0);
    const h = 1e-6;
    const fd =
      (fitIntensitySternVolmer({ concentrations, intensities, intercept: 'fixed-at-one', i0: i0 * (1 + h) }).kSv.value -
        fitIntensitySternVolmer({ concentrations, intensities, intercept: 'fixed-at-one', i0: i0 * (1 - h) }).kSv
          .value) /
      (2 * h);
    expect(fd / (fixed.kSv.value + sumQ / sumQ2)).toBeCloseTo(1, 6);
  });

  it('when τ0 comes from lifetime blanks and the intercept is fixed, then the same sensitivity holds', () => {
    const lifetimes = intensities.map((value) => value * 1e-9); // invented: 1 count ↔ 1 ns
    const fit = (tau0?: number) =>
      fitLifetimeSternVolmer({ concentrations, lifetimes, intercept: 'fixed-at-one', ...(tau0 ? { tau0 } : {}) });
    const tau0 = i0 * 1e-9;
    const h = 1e-6;
    const derivative = (fit(tau0 * (1 + h)).kSv.value - fit(tau0 * (1 - h)).kSv.value) / (2 * h * tau0);
    const expected = Math.hypot(fit(tau0).kSv.standardError, derivative * tau0 * relativeSe);
    expect(Math.abs(fit().kSv.standardError - expected) / expected).toBeLessThan(1e-6);
  });
});
