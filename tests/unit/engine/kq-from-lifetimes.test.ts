import { describe, expect, it } from 'vitest';
import { linearRegression } from 'simple-statistics';
import { fitLifetimeSternVolmer, kqFromLifetimes, quenchingRateConstant } from '@shared/engine';
import { expectClose } from './support/expect-close';

// Invented lifetimes near tau0 = 1.0 µs and kq = 2e9 M^-1 s^-1, with three blanks that scatter.
const concentrations = [0, 0, 0, 1e-4, 2e-4, 3e-4, 4e-4, 5e-4];
const lifetimes = [1.02e-6, 0.98e-6, 1.0e-6, 0.845e-6, 0.71e-6, 0.63e-6, 0.55e-6, 0.505e-6];

describe('kq from lifetimes: slope of 1/τ against [Q]', () => {
  it('when lifetimes are given, then kq is the slope of 1/τ = 1/τ0 + kq [Q], with its own SE', () => {
    const points = concentrations.map((q, i) => [q, 1 / lifetimes[i]!]);
    // Reference: simple-statistics linearRegression on (q, 1/τ); SE by hand, sqrt(SS_res / (n - 2) / Sxx)
    // (the same as numpy: np.polyfit(q, 1/tau, 1, cov='unscaled') scaled by SS_res/(n-2)).
    const line = linearRegression(points);
    const mean = concentrations.reduce((a, b) => a + b, 0) / concentrations.length;
    const sxx = concentrations.reduce((sum, q) => sum + (q - mean) ** 2, 0);
    const ssRes = points.reduce((sum, [q, y]) => sum + (y! - line.b - line.m * q!) ** 2, 0);
    const se = Math.sqrt(ssRes / (concentrations.length - 2) / sxx);
    const kq = kqFromLifetimes({ concentrations, lifetimes });
    expectClose(kq.kq.value, line.m, 1e-12);
    expectClose(kq.kq.standardError, se, 1e-10);
    expectClose(kq.inverseTau0.value, line.b, 1e-12);
    expect(kq.degreesOfFreedom).toBe(concentrations.length - 2);
  });

  it('when τ0 has its own uncertainty, then kq does not count it a second time', () => {
    // The old route: K_SV from τ0/τ (τ0 from the blanks, its SE propagated into the ratios) divided by
    // τ0 again with its SE in quadrature. The slope of 1/τ needs no τ0 at all, so its SE stays smaller.
    const lifetimeFit = fitLifetimeSternVolmer({ concentrations, lifetimes });
    const twice = quenchingRateConstant({
      kSv: lifetimeFit.kSv.value,
      kSvStandardError: lifetimeFit.kSv.standardError,
      tau0: lifetimeFit.tau0.value,
      tau0StandardError: lifetimeFit.tau0.value * (lifetimeFit.tau0.relativeStandardError ?? 0),
    });
    const slope = kqFromLifetimes({ concentrations, lifetimes });
    expect(slope.kq.standardError).toBeLessThan(twice.standardError);
  });
});
