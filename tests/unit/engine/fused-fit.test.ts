import { describe, expect, it } from 'vitest';
import quantile from '@stdlib/stats-base-dists-t-quantile';
import { fitSternVolmer, studentTTwoSidedPValue } from '@shared/engine';
import { expectClose } from './support/expect-close';
import { readCertified, readNistSeries } from './support/nist-fixture';

// fitSternVolmer forms its line, residual runs and x^2 test from fused centred sums, not
// through fitLine; these hold that path to the NIST StRD certified values (fixtures in
// tests/fixtures/nist-strd). Norris, NoInt1/2 and Pontius have x >= 0 and y > 0, so they
// are valid Stern–Volmer input as they stand.
const NINE_DIGITS = 1e-9;
const SEVEN_DIGITS = 1e-7;

describe('fitSternVolmer on NIST StRD data', () => {
  it('Norris: slope, intercept, their SDs, residual SD and R^2 to nine digits', () => {
    const { x, y } = readNistSeries('Norris');
    const certified = readCertified('Norris');
    const [b0, b1] = certified.parameters;
    const fit = fitSternVolmer({ concentrations: x, ratios: y });
    expectClose(fit.kSv.value, b1!.estimate, NINE_DIGITS); // NIST Norris B1
    expectClose(fit.kSv.standardError, b1!.sd, NINE_DIGITS); // NIST Norris sd(B1)
    expectClose(fit.fittedIntercept!.value, b0!.estimate, NINE_DIGITS); // NIST Norris B0
    expectClose(fit.fittedIntercept!.standardError, b0!.sd, NINE_DIGITS); // NIST Norris sd(B0)
    expectClose(fit.residualStandardDeviation, certified.residual_sd, NINE_DIGITS); // NIST residual SD
    expectClose(fit.rSquared, certified.r_squared, NINE_DIGITS); // NIST Norris R^2
  });

  it.each(['NoInt1', 'NoInt2'])(
    '%s: with the intercept fixed at 1, ratio - 1 = y goes through the origin (nine digits)',
    (name) => {
      const { x, y } = readNistSeries(name);
      const certified = readCertified(name);
      // NoInt1 and NoInt2 y are integers, so (y + 1) - 1 === y exactly.
      const fit = fitSternVolmer({ concentrations: x, ratios: y.map((value) => value + 1), intercept: 'fixed-at-one' });
      expectClose(fit.kSv.value, certified.parameters[0]!.estimate, NINE_DIGITS); // NIST B1
      expectClose(fit.kSv.standardError, certified.parameters[0]!.sd, NINE_DIGITS); // NIST sd(B1)
      expectClose(fit.residualStandardDeviation, certified.residual_sd, NINE_DIGITS); // NIST residual SD
      expectClose(fit.rSquared, certified.r_squared, NINE_DIGITS); // NIST uncentred R^2
    },
  );

  it('Pontius: the x^2 term of the diagnosis gives the certified B2 and sd(B2) to seven digits', () => {
    const { x, y } = readNistSeries('Pontius');
    const b2 = readCertified('Pontius').parameters[2]!;
    const { diagnosis } = fitSternVolmer({ concentrations: x, ratios: y });
    expectClose(diagnosis.quadraticCoefficient!.value, b2.estimate, SEVEN_DIGITS); // NIST Pontius B2
    expectClose(diagnosis.quadraticCoefficient!.standardError, b2.sd, SEVEN_DIGITS); // NIST Pontius sd(B2)
    expect(diagnosis.shape).toBe('downward');
  });

  it('runs counted during the pass (x ascending) equal the sorted count (Norris file order is unsorted)', () => {
    const { x, y } = readNistSeries('Norris');
    const sorted = fitSternVolmer({ concentrations: x, ratios: y }); // residuals sorted by x, then counted
    const order = x.map((_, i) => i).sort((a, b) => x[a]! - x[b]!);
    const ascending = fitSternVolmer({ concentrations: order.map((i) => x[i]!), ratios: order.map((i) => y[i]!) });
    expect(ascending.diagnosis.runs).toEqual(sorted.diagnosis.runs);
    expectClose(ascending.kSv.value, sorted.kSv.value, 1e-12);
  });
});

describe('Student t p-value above 300 degrees of freedom', () => {
  it('inverts the @stdlib quantile to 1e-9 for df from 301 to 1e7', () => {
    // quantile(1 - alpha/2, df) from @stdlib/stats-base-dists-t-quantile 0.2.3
    for (const df of [301, 302, 999, 1000, 5001, 99_997, 99_998, 1e7]) {
      for (const alpha of [0.999, 0.5, 0.2, 0.05, 0.01, 0.001, 1e-6]) {
        expectClose(studentTTwoSidedPValue(quantile(1 - alpha / 2, df), df), alpha, 1e-9);
      }
    }
  });
});
