import { normalCdf } from './normal-cdf';

/** Wald–Wolfowitz runs test on the signs of residuals. */
export interface RunsTestResult {
  runs: number;
  positives: number;
  negatives: number;
  /** 2 n+ n- / (n+ + n-) + 1 */
  expectedRuns: number;
  /** P(R <= observed runs): small when residuals of one sign cluster (systematic misfit) */
  pValue: number;
  method: 'exact' | 'normal-approximation' | 'not-applicable';
}

// Up to this many signs the exact distribution is summed (binomials stay below 1e60).
const EXACT_LIMIT = 200;

/**
 * The runs test of residualRunsTest from counts already made: `runs` maximal blocks of
 * equal sign among `positives` + `negatives` non-zero residuals taken in x order. Lets a
 * fit count the signs while it forms the residuals, without a second pass.
 *
 * @param runs - number of runs
 * @param positives - residuals > 0
 * @param negatives - residuals < 0
 * @example runsTestFromCounts(3, 6, 4).runs // 3
 */
export function runsTestFromCounts(runs: number, positives: number, negatives: number): RunsTestResult {
  const total = positives + negatives;
  const expectedRuns = total > 0 ? (2 * positives * negatives) / total + 1 : 0;
  if (positives === 0 || negatives === 0) {
    return { runs, positives, negatives, expectedRuns, pValue: 1, method: 'not-applicable' };
  }
  if (total <= EXACT_LIMIT) {
    return {
      runs,
      positives,
      negatives,
      expectedRuns,
      pValue: exactLowerTail(runs, positives, negatives),
      method: 'exact',
    };
  }
  const product = 2 * positives * negatives;
  const variance = (product * (product - total)) / (total * total * (total - 1));
  const z = (runs + 0.5 - expectedRuns) / Math.sqrt(variance);
  return { runs, positives, negatives, expectedRuns, pValue: normalCdf(z), method: 'normal-approximation' };
}

/** P(R <= r) for n1 and n2 signs, summing P(R = 2k) and P(R = 2k + 1). */
function exactLowerTail(r: number, n1: number, n2: number): number {
  let sum = 0;
  // c1 = C(n1 - 1, k - 1) and c2 = C(n2 - 1, k - 1), updated as k grows.
  let c1 = 1;
  let c2 = 1;
  for (let k = 1; 2 * k <= r && c1 > 0 && c2 > 0; k++) {
    const c1Next = (c1 * Math.max(0, n1 - k)) / k;
    const c2Next = (c2 * Math.max(0, n2 - k)) / k;
    sum += 2 * c1 * c2;
    if (2 * k + 1 <= r) sum += c1Next * c2 + c1 * c2Next;
    c1 = c1Next;
    c2 = c2Next;
  }
  return Math.min(1, sum / binomial(n1 + n2, n1));
}

function binomial(n: number, k: number): number {
  const m = Math.min(k, n - k);
  let value = 1;
  for (let i = 1; i <= m; i++) value = (value * (n - m + i)) / i;
  return value;
}
