import { runsTestFromCounts, type RunsTestResult } from './runs-test-from-counts';

export type { RunsTestResult } from './runs-test-from-counts';

/**
 * Runs test of Wald and Wolfowitz (Ann. Math. Stat. 1940, 11, 147) on residual signs,
 * lower tail: too few runs means residuals of one sign come in blocks, as when a
 * straight line is fitted to a curve. Exact distribution (Swed & Eisenhart, Ann. Math.
 * Stat. 1943, 14, 66) up to 200 signs, normal approximation with continuity correction
 * beyond. Residuals that are exactly zero carry no sign and are skipped.
 *
 * @param residuals - residuals in fit order (sorted by x)
 * @returns p-value 1 and method 'not-applicable' when all signs are equal
 * @example residualRunsTest([1, 1, 1, -1, -1, -1, -1, 1, 1, 1]).runs // 3
 */
export function residualRunsTest(residuals: ArrayLike<number>): RunsTestResult {
  let positives = 0;
  let negatives = 0;
  let runs = 0;
  let lastSign = 0;
  for (let i = 0; i < residuals.length; i++) {
    // i < residuals.length: an element.
    const sign = residuals[i]! > 0 ? 1 : residuals[i]! < 0 ? -1 : 0;
    if (sign === 0) continue;
    if (sign > 0) positives++;
    else negatives++;
    if (sign !== lastSign) runs++;
    lastSign = sign;
  }
  return runsTestFromCounts(runs, positives, negatives);
}
