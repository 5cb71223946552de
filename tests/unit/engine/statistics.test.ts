import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import quantile from '@stdlib/stats-base-dists-t-quantile';
import { erf, linearRegression, linearRegressionLine, rSquared, sampleVariance } from 'simple-statistics';
import {
  extraSumOfSquaresFTest,
  fitLine,
  fitLineThroughOrigin,
  normalCdf,
  residualRunsTest,
  studentTQuantile975,
  studentTTwoSidedPValue,
} from '@shared/engine';
import { expectClose } from './support/expect-close';
import { seededNormal, seededRandom } from './support/seeded-random';

describe('Student t distribution', () => {
  it('quantile is the value of @stdlib/stats-base-dists-t-quantile', () => {
    // quantile(0.975, df) from @stdlib/stats-base-dists-t-quantile 0.2.3
    for (const df of [1, 2, 5, 10, 34, 120]) expect(studentTQuantile975(df)).toBe(quantile(0.975, df));
  });

  it('two-sided p-value inverts the stdlib quantile for every df from 1 to 300', () => {
    // Abramowitz & Stegun 26.7.3/26.7.4 series vs @stdlib quantile(1 - alpha/2, df)
    for (let df = 1; df <= 300; df++) {
      for (const alpha of [0.2, 0.05, 0.01, 0.001]) {
        expectClose(studentTTwoSidedPValue(quantile(1 - alpha / 2, df), df), alpha, 1e-9);
      }
    }
  });

  it('keeps its relative precision far in the tails, where 1 - P(inside) would cancel', () => {
    // Closed forms (hand derivation from the densities; Abramowitz & Stegun 26.7.3/26.7.4 with one term):
    // df = 1 (Cauchy): P(|T| >= t) = (2/pi) atan(1/t); df = 2: P = 1 - t/sqrt(t^2 + 2) = 2/(s (s + t)), s = sqrt(t^2 + 2).
    for (const t of [1e3, 1e5, 1e7]) {
      expectClose(studentTTwoSidedPValue(t, 1), (2 / Math.PI) * Math.atan(1 / t), 1e-12);
      const s = Math.sqrt(t * t + 2);
      expectClose(studentTTwoSidedPValue(t, 2), 2 / (s * (s + t)), 1e-12);
    }
  });

  it('rejects a non-integer df for the p-value', () => {
    expect(() => studentTTwoSidedPValue(2, 2.5)).toThrowError(/positive integer/);
  });
});

describe('normal distribution function', () => {
  it('gives 0.975 at the familiar 1.959963984540054 (standard normal tables)', () => {
    expectClose(normalCdf(1.959963984540054), 0.975, 1e-12);
  });

  it('agrees with simple-statistics erf within its stated 1.2e-7 accuracy', () => {
    // simple-statistics erf(x) (Abramowitz & Stegun 7.1.26-type approximation)
    for (let z = -5; z <= 5; z += 0.25) {
      expect(Math.abs(normalCdf(z) - 0.5 * (1 + erf(z / Math.SQRT2)))).toBeLessThan(2e-7);
    }
  });
});

describe('Wald–Wolfowitz runs test', () => {
  it('counts runs of residual signs, skipping exact zeros', () => {
    const result = residualRunsTest([1, 2, 0, -1, -3, 4, 5, -1]);
    expect(result).toMatchObject({ runs: 4, positives: 4, negatives: 3 });
    expectClose(result.expectedRuns, (2 * 4 * 3) / 7 + 1, 1e-15); // Wald & Wolfowitz 1940 mean
  });

  it('matches the Swed–Eisenhart critical value for n1 = n2 = 10 (6 runs at the 2.5 % level)', () => {
    // Swed & Eisenhart (1943) table of critical runs: lower 2.5 % value 6 for 10 + 10 —
    // from memory, unverified; asserted only as the bracket P(R <= 6) <= 0.025 < P(R <= 7).
    const fromRuns = (lengths: number[]) =>
      lengths.flatMap((length, i) => Array<number>(length).fill(i % 2 === 0 ? 1 : -1));
    const six = residualRunsTest(fromRuns([5, 5, 3, 3, 2, 2]));
    const seven = residualRunsTest(fromRuns([4, 4, 3, 3, 2, 3, 1]));
    expect([six.runs, six.positives, six.negatives]).toEqual([6, 10, 10]);
    expect([seven.runs, seven.positives, seven.negatives]).toEqual([7, 10, 10]);
    expect(six.pValue).toBeLessThanOrEqual(0.025);
    expect(seven.pValue).toBeGreaterThan(0.025);
  });

  it('exact distribution sums to 1 over all possible run counts', () => {
    // P(R <= max runs) = 1 by construction of the Swed–Eisenhart distribution
    const alternating = Array.from({ length: 14 }, (_, i) => (i % 2 === 0 ? 1 : -1));
    expectClose(residualRunsTest(alternating).pValue, 1, 1e-12);
  });

  it('exact lower tail agrees with the normal approximation for large balanced samples', () => {
    // Wald & Wolfowitz (1940) asymptotic normality: compare at n = 200 (exact) using the
    // same mean and variance formulas; within 0.01 in probability.
    const random = seededRandom(7);
    const residuals = Array.from({ length: 200 }, () => (random() < 0.5 ? -1 : 1));
    const exact = residualRunsTest(residuals);
    const n1 = exact.positives;
    const n2 = exact.negatives;
    const n = n1 + n2;
    const variance = (2 * n1 * n2 * (2 * n1 * n2 - n)) / (n * n * (n - 1));
    const approx = normalCdf((exact.runs + 0.5 - exact.expectedRuns) / Math.sqrt(variance));
    expect(exact.method).toBe('exact');
    expect(Math.abs(exact.pValue - approx)).toBeLessThan(0.01);
  });
});

describe('extra-sum-of-squares F test', () => {
  it('F(1, df) p-value equals the two-sided t p-value of sqrt(F) and the critical value is t^2', () => {
    const result = extraSumOfSquaresFTest(
      { residualSumOfSquares: 10, degreesOfFreedom: 10 },
      { residualSumOfSquares: 5, degreesOfFreedom: 9 },
    );
    expect(result.fStatistic).toBe(9); // (10 - 5) / (5 / 9)
    expectClose(result.criticalValue95, quantile(0.975, 9) ** 2, 1e-15); // F(1,9) 0.95 = t(9) 0.975 squared
    expectClose(result.pValue, studentTTwoSidedPValue(3, 9), 1e-15);
  });
});

describe('straight-line fits against simple-statistics on seeded random series', () => {
  const normal = seededNormal(42);
  const random = seededRandom(43);
  const series = Array.from({ length: 20 }, () => {
    const n = 5 + Math.floor(random() * 30);
    const slope = (random() - 0.5) * 1e4;
    const intercept = random() * 3;
    const x = Array.from({ length: n }, () => random() * 1e-2);
    const y = x.map((xi) => intercept + slope * xi + 0.05 * normal());
    return { x, y };
  });

  it('slope, intercept and R^2 equal linearRegression and rSquared', () => {
    for (const { x, y } of series) {
      const fit = fitLine(x, y);
      const pairs = x.map((xi, i) => [xi, y[i]!]);
      const reference = linearRegression(pairs); // simple-statistics linearRegression(pairs)
      expectClose(fit.slope, reference.m, 1e-9);
      expectClose(fit.intercept, reference.b, 1e-9);
      // simple-statistics rSquared(pairs, linearRegressionLine(reference))
      expectClose(fit.rSquared, rSquared(pairs, linearRegressionLine(reference)), 1e-9);
    }
  });

  it('slope standard error equals s / sqrt(Sxx) built from simple-statistics sampleVariance', () => {
    for (const { x, y } of series) {
      const fit = fitLine(x, y);
      const line = linearRegressionLine(linearRegression(x.map((xi, i) => [xi, y[i]!])));
      const ss = y.reduce((sum, yi, i) => sum + (yi - line(x[i]!)) ** 2, 0);
      const sxx = sampleVariance(x) * (x.length - 1);
      expectClose(fit.slopeStandardError, Math.sqrt(ss / (x.length - 2) / sxx), 1e-8);
    }
  });

  it('equal weights give the unweighted fit; integer weights equal repeated points', () => {
    const { x, y } = series[0]!;
    const plain = fitLine(x, y);
    const weighted = fitLine(
      x,
      y,
      x.map(() => 4),
    );
    expectClose(weighted.slope, plain.slope, 1e-12);
    expectClose(weighted.slopeStandardError, plain.slopeStandardError, 1e-10);
    const repeats = x.map((_, i) => 1 + (i % 3));
    const expandedX = x.flatMap((xi, i) => Array(repeats[i]).fill(xi) as number[]);
    const expandedY = y.flatMap((yi, i) => Array(repeats[i]).fill(yi) as number[]);
    expectClose(fitLine(x, y, repeats).slope, fitLine(expandedX, expandedY).slope, 1e-10);
    expectClose(fitLineThroughOrigin(x, y, repeats).slope, fitLineThroughOrigin(expandedX, expandedY).slope, 1e-12);
  });

  it('fit does not depend on point order (property)', () => {
    fc.assert(
      fc.property(
        fc.shuffledSubarray(
          series[1]!.x.map((_, i) => i),
          { minLength: series[1]!.x.length },
        ),
        (order) => {
          const { x, y } = series[1]!;
          const fit = fitLine(
            order.map((i) => x[i]!),
            order.map((i) => y[i]!),
          );
          const reference = fitLine(x, y);
          return Math.abs(fit.slope - reference.slope) <= 1e-9 * Math.abs(reference.slope);
        },
      ),
    );
  });
});
