import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { correctDilution, correctInnerFilter, planTitration, screenSeries } from '@shared/engine';
import { expectClose } from './support/expect-close';

describe('inner-filter correction F_corr = F_obs 10^((A_ex + A_em)/2) (Lakowicz, 3rd ed., ch. 2)', () => {
  it('gives 1.1885 for A_ex 0.10, A_em 0.05 and 1.585 for 0.20 and 0.20 (10^0.075, 10^0.2, by hand)', () => {
    expectClose(
      correctInnerFilter({ intensity: 1, absorbanceExcitation: 0.1, absorbanceEmission: 0.05 }).factor,
      1.1885,
      1e-4,
    );
    expectClose(
      correctInnerFilter({ intensity: 1, absorbanceExcitation: 0.2, absorbanceEmission: 0.2 }).factor,
      1.585,
      1e-3,
    );
    expectClose(
      correctInnerFilter({ intensity: 200, absorbanceExcitation: 0.2, absorbanceEmission: 0.2 }).correctedIntensity,
      200 * 10 ** 0.2,
      1e-12,
    );
  });

  it('flags corrections above 5 % and not below', () => {
    expect(correctInnerFilter({ intensity: 1, absorbanceExcitation: 0.02, absorbanceEmission: 0.01 }).flags).toEqual(
      [],
    );
    expect(
      correctInnerFilter({ intensity: 1, absorbanceExcitation: 0.1, absorbanceEmission: 0.05 }).flags[0]!.code,
    ).toBe('INNER_FILTER_LARGE');
  });

  it('rejects negative absorbance with advice', () => {
    expect(() => correctInnerFilter({ intensity: 1, absorbanceExcitation: -0.01, absorbanceEmission: 0 })).toThrowError(
      /^absorbanceExcitation: must not be negative, got -0.01\. Absorbances below zero/,
    );
  });
});

describe('dilution correction (mass balance, shared/engine/README.md section 4)', () => {
  it('[Q] = c V_add/(V0 + V_add) and I_corr = I (V0 + V_add)/V0', () => {
    const [blank, point] = correctDilution({
      initialVolume: 2e-3,
      stockConcentration: 0.1,
      cumulativeAddedVolumes: [0, 2e-5],
      intensities: [100, 90],
    });
    expect(blank).toEqual({ concentration: 0, dilutionFactor: 1, correctedIntensity: 100 });
    expectClose(point!.concentration, (0.1 * 2e-5) / 2.02e-3, 1e-15);
    expectClose(point!.correctedIntensity!, 90 * 1.01, 1e-15);
  });

  it('leaves intensities alone when the stock carries the emitter', () => {
    const [, point] = correctDilution({
      initialVolume: 2e-3,
      stockConcentration: 0.1,
      cumulativeAddedVolumes: [0, 2e-5],
      intensities: [100, 90],
      stockContainsEmitter: true,
    });
    expect(point!.correctedIntensity).toBe(90);
  });
});

describe('titration planner', () => {
  it('volumes reproduce the targets exactly (property), and the dilution correction agrees', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5e-3, max: 5e-3, noNaN: true }),
        fc.double({ min: 0.01, max: 2, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        (v0, stock, count, fractionOfStock) => {
          const plan = planTitration({
            initialVolume: v0,
            emitterConcentration: 1e-5,
            stockConcentration: stock,
            maximum: stock * fractionOfStock,
            count,
          });
          const cumulative = plan.steps.map((step) => step.cumulativeAddedMicrolitres * 1e-6);
          const viaDilution = correctDilution({
            initialVolume: v0,
            stockConcentration: stock,
            cumulativeAddedVolumes: cumulative,
          });
          return plan.steps.every(
            (step, i) =>
              Math.abs(step.concentration - step.target) <= 1e-12 * step.target &&
              Math.abs(viaDilution[i]!.concentration - step.target) <= 1e-12 * step.target,
          );
        },
      ),
    );
  });

  it('gives additions in µL, cumulative volume and emitter dilution; warns beyond 10 %', () => {
    const plan = planTitration({
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.05,
      targets: [1e-3, 2e-3, 6e-3],
    });
    expectClose(plan.steps[0]!.additionMicrolitres, ((1e-3 * 2e-3) / (0.05 - 1e-3)) * 1e6, 1e-12); // V = c V0 / (c_stock - c)
    const total = plan.steps[2]!.cumulativeAddedMicrolitres;
    expectClose(
      plan.steps.reduce((sum, step) => sum + step.additionMicrolitres, 0),
      total,
      1e-12,
    );
    expectClose(plan.steps[2]!.emitterConcentration, (1e-5 * 2000) / (2000 + total), 1e-12);
    expect(plan.totalDilution).toBeGreaterThan(0.1);
    expect(plan.flags.map((flag) => flag.code)).toEqual(['LARGE_DILUTION']);
    const withEmitter = planTitration({
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.05,
      targets: [5e-3],
      stockContainsEmitter: true,
    });
    expect(withEmitter.flags).toEqual([]);
  });

  it('reports the real concentration when volumes are rounded to the pipette step', () => {
    const plan = planTitration({
      initialVolume: 2e-3,
      emitterConcentration: 1e-5,
      stockConcentration: 0.1,
      targets: [1e-3],
      volumeStep: 1e-6,
    });
    expect(plan.steps[0]!.additionMicrolitres).toBeCloseTo(20, 9);
    expectClose(plan.steps[0]!.concentration, (0.1 * 20e-6) / 2.02e-3, 1e-12);
  });

  it('a target at or above the stock concentration is a typed error', () => {
    expect(() =>
      planTitration({
        initialVolume: 2e-3,
        emitterConcentration: 1e-5,
        stockConcentration: 0.01,
        targets: [5e-3, 0.01],
      }),
    ).toThrowError(
      expect.objectContaining({
        code: 'TARGET_UNREACHABLE',
        message: expect.stringMatching(/^targets\[1\]: 0.01 mol\/L cannot be reached with a 0.01 mol\/L stock/),
      }),
    );
  });
});

describe('series screening', () => {
  it('lists every problem without throwing', () => {
    const screen = screenSeries({ concentrations: [1e-3, 2e-3, 2e-3], intensities: [80, 0, Number.NaN] });
    expect(screen.fittable).toBe(false);
    expect(screen.flags.map((flag) => [flag.code, flag.severity])).toEqual([
      ['NON_POSITIVE_INTENSITY', 'error'],
      ['FEW_CONCENTRATIONS', 'error'],
      ['NO_I0', 'error'],
    ]);
    const absorbing = screenSeries({
      concentrations: [0, 1, 2, 3, 4],
      intensities: [5, 4, 3, 2, 1],
      absorbancesExcitation: [0, 0, 0, 0.1, 0.2],
    });
    expect(absorbing.fittable).toBe(true);
    expect(absorbing.flags[0]).toMatchObject({ code: 'INNER_FILTER_LARGE', detail: 'points 3, 4' });
  });
});
