import { describe, expect, it, vi } from 'vitest';
import { fitLine, fitStudy } from '@shared/engine';
import { correctDilution } from '@shared/engine/corrections/correct-dilution';
import type * as CorrectDilutionModule from '@shared/engine/corrections/correct-dilution';
import { readCertified, readNistSeries } from './support/nist-fixture';
import { expectClose } from './support/expect-close';
import { fitPoint, fitSettings } from './support/study-fit-fixture';

// The engine's own modules, wrapped so the test can count how often the pipeline calls them.
vi.mock('@shared/engine/corrections/correct-dilution', async (original) => {
  const actual = await original<typeof CorrectDilutionModule>();
  return { ...actual, correctDilution: vi.fn(actual.correctDilution) };
});
// ml-regression-simple-linear stays the tests' independent cross-check (nist-strd.test.ts); the
// engine must not take its numbers from it, so here it refuses to run.
vi.mock('ml-regression-simple-linear', () => ({
  SimpleLinearRegression: class {
    constructor() {
      throw new Error('the engine has its own least-squares path');
    }
  },
}));

const settings = fitSettings({ dilutionCorrection: true, initialVolume: 2e-3, stockConcentration: 0.1 });

describe('one pass per point (issue 13, finding 12)', () => {
  it('when dilution-corrected points also carry lifetimes, then each point is corrected once', () => {
    // Invented titration: 0-80 µL of 0.1 M stock into 2 mL, lifetimes 1 µs / (1 + 500 [Q]).
    const points = [0, 20e-6, 40e-6, 60e-6, 80e-6].map((volume, position) => {
      const q = (0.1 * volume) / (2e-3 + volume);
      return fitPoint(position, (0.1 * volume) / 2e-3, ((1000 / (1 + 500 * q)) * 2e-3) / (2e-3 + volume), {
        lifetime: 1e-6 / (1 + 500 * q),
        volumeAdded: volume,
        excluded: position === 4,
      });
    });
    vi.mocked(correctDilution).mockClear();
    const fit = fitStudy(settings, points, 'linear-free');
    expect(fit.kSv).toBeCloseTo(500, 6); // constructed exact line, K_SV = 500 M^-1 by hand
    expect(vi.mocked(correctDilution)).toHaveBeenCalledTimes(points.length);
  });
});

describe('corrected values kept with the fit (issue 13, item 5 of the last note)', () => {
  it('when dilution is corrected, then the result holds every point’s corrected values, the left-out one too', () => {
    // Invented titration: 0-80 µL of 0.1 M stock into 2 mL, I as measured = 1000 (V0/(V0+V)) / (1 + 500 [Q]).
    const volumes = [0, 20e-6, 40e-6, 60e-6, 80e-6];
    const points = volumes.map((volume, position) => {
      const q = (0.1 * volume) / (2e-3 + volume);
      return fitPoint(position, (0.1 * volume) / 2e-3, ((1000 / (1 + 500 * q)) * 2e-3) / (2e-3 + volume), {
        volumeAdded: volume,
        excluded: position === 3,
      });
    });
    const fit = fitStudy(settings, points, 'linear-free');
    const corrections = fit.result.corrections!;
    expect(corrections.map((entry) => entry.position)).toEqual([0, 1, 2, 3, 4]);
    volumes.forEach((volume, i) => {
      // by hand (mass balance, common practice): [Q] = c_stock V/(V0 + V), I_corr = I_obs (V0 + V)/V0
      const q = (0.1 * volume) / (2e-3 + volume);
      expect(corrections[i]!.concentration).toBeCloseTo(q, 15);
      expect(corrections[i]!.intensity).toBeCloseTo(1000 / (1 + 500 * q), 9);
      expect(corrections[i]!.dilutionFactor).toBeCloseTo((2e-3 + volume) / 2e-3, 12);
      expect(corrections[i]!.innerFilterFactor).toBeNull();
    });
  });

  it('when no correction is on, then the result holds none', () => {
    const points = [0, 1e-3, 2e-3, 3e-3].map((q, i) => fitPoint(i, q, 1000 / (1 + 500 * q)));
    expect(fitStudy(fitSettings(), points, 'linear-free').result.corrections).toBeNull();
  });
});

describe('fitLine has one least-squares path (issue 13, finding 12)', () => {
  it('when the cross-check library cannot run, then fitLine still meets NIST StRD Norris to nine digits', () => {
    const { x, y } = readNistSeries('Norris');
    const certified = readCertified('Norris');
    const [b0, b1] = certified.parameters;
    const fit = fitLine(x, y);
    expectClose(fit.intercept, b0!.estimate, 1e-9); // NIST Norris B0
    expectClose(fit.slope, b1!.estimate, 1e-9); // NIST Norris B1
  });
});
