import { EngineError } from '../core/engine-error';
import {
  countDistinct,
  requireFiniteArray,
  requireNonNegativeArray,
  requirePositiveArray,
  requireSameLength,
} from '../core/validate';
import { KSV_RELATIVE_SE_FLAG_ABOVE, qualityFlag, R_SQUARED_FLAG_BELOW, type QualityFlag } from '../flags/quality-flag';
import { fitLineWithCurvature } from '../stats/fit-line-with-curvature';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { residualRunsTest } from '../stats/runs-test';
import { runsTestFromCounts } from '../stats/runs-test-from-counts';
import { scanPoints } from '../stats/scan-points';
import { classifyCurvature } from './classify-curvature';
import type { CurvatureDiagnosis, InterceptMode } from './diagnose-curvature';
import { residualsInConcentrationOrder } from './residuals-in-concentration-order';

export interface SternVolmerInput {
  /** quencher concentrations [Q], mol/L, >= 0 */
  concentrations: readonly number[];
  /** I0/I or tau0/tau, > 0 */
  ratios: readonly number[];
  /** optional 1-sigma uncertainties of the ratios; weights 1/sigma^2 */
  ratioUncertainties?: readonly number[];
  /** default 'free' */
  intercept?: InterceptMode;
}

export interface SternVolmerFit {
  intercept: InterceptMode;
  /** Stern–Volmer constant K_SV, M^-1 */
  kSv: ParameterEstimate;
  /** fitted intercept (dimensionless); null when fixed at exactly 1 */
  fittedIntercept: ParameterEstimate | null;
  /** 'centred' with a free intercept; 'uncentred' (1 - SS_res / sum w (ratio-1)^2) with it fixed */
  rSquared: number;
  rSquaredDefinition: 'centred' | 'uncentred';
  /**
   * centred R² of the fitted line, 1 - SS_res / sum w (ratio - weighted mean)^2: the same as
   * rSquared with a free intercept; with the intercept fixed it says how well the line through 1
   * fits compared with a flat line (it can be below 0), where the uncentred value stays near 1.
   */
  rSquaredCentred: number;
  /** ratio - fitted, in input order */
  residuals: number[];
  residualStandardDeviation: number;
  residualSumOfSquares: number;
  degreesOfFreedom: number;
  n: number;
  distinctConcentrations: number;
  weighted: boolean;
  /** the exact points used, in input order (the caller's arrays, not copies) */
  points: { concentrations: readonly number[]; ratios: readonly number[] };
  diagnosis: CurvatureDiagnosis;
  flags: QualityFlag[];
}

/** Fewer distinct concentrations than this draws a warning; fewer than 3 is an error. */
export const RECOMMENDED_DISTINCT_CONCENTRATIONS = 5;

/**
 * Linear Stern–Volmer fit ratio = 1 + K_SV [Q] (Stern & Volmer, Phys. Z. 1919, 20, 183;
 * IUPAC Gold Book S06004), either with a free intercept or with the intercept fixed at 1
 * (regression of ratio - 1 through the origin). Returns K_SV with its standard error and
 * Student's t 95 % interval, R^2, residuals, the curvature diagnosis and quality flags.
 *
 * @param input.concentrations - [Q] in mol/L (>= 0; at least 3 distinct values)
 * @param input.ratios - I0/I or tau0/tau (> 0)
 * @param input.ratioUncertainties - optional 1-sigma of each ratio (> 0)
 * @param input.intercept - 'free' (default) or 'fixed-at-one'
 * @throws EngineError LENGTH_MISMATCH, NON_FINITE_VALUE, NEGATIVE_VALUE, NON_POSITIVE_VALUE, TOO_FEW_CONCENTRATIONS
 * @example fitSternVolmer({ concentrations: [0, 1e-3, 2e-3, 3e-3, 4e-3], ratios: [1, 1.5, 2, 2.5, 3] }).kSv.value // 500
 */
export function fitSternVolmer(input: SternVolmerInput): SternVolmerFit {
  const { concentrations, ratios, ratioUncertainties, intercept = 'free' } = input;
  requireSameLength(concentrations, ratios, 'concentrations', 'ratios');
  let weights: Float64Array | undefined;
  if (ratioUncertainties) {
    requireSameLength(concentrations, ratioUncertainties, 'concentrations', 'ratioUncertainties');
    requireFiniteArray(ratioUncertainties, 'ratioUncertainties');
    requirePositiveArray(
      ratioUncertainties,
      'ratioUncertainties',
      'Every point needs a positive uncertainty to be weighted',
    );
    weights = new Float64Array(ratioUncertainties.length);
    // weights was made with ratioUncertainties.length entries, so index i exists in both.
    for (let i = 0; i < weights.length; i++) weights[i] = 1 / (ratioUncertainties[i]! * ratioUncertainties[i]!);
  }
  // One pass reads the points; the validators that name a bad entry run only if it saw one.
  const scan = scanPoints(concentrations, ratios, weights);
  if (!scan.finite || !(scan.minX >= 0) || !(scan.minY > 0)) {
    requireNonNegativeArray(
      concentrations,
      'concentrations',
      'Concentrations are amounts added and cannot be negative',
    );
    requirePositiveArray(ratios, 'ratios');
    if (weights) requirePositiveArray(weights, 'weights');
  }
  const distinctConcentrations = scan.distinctX >= 0 ? scan.distinctX : countDistinct(concentrations);
  if (distinctConcentrations < 3) {
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      `only ${distinctConcentrations} distinct concentration${distinctConcentrations === 1 ? '' : 's'}; at least 3 are needed`,
      `Measure at least ${RECOMMENDED_DISTINCT_CONCENTRATIONS} different concentrations`,
    );
  }
  const fixed = intercept === 'fixed-at-one';
  // With the intercept fixed at 1, ratio - 1 is regressed through the origin.
  const line = fitLineWithCurvature(concentrations, ratios, scan, {
    ...(weights ? { weights } : {}),
    throughOrigin: fixed,
    yOffset: fixed ? 1 : 0,
  });
  const df = line.degreesOfFreedom;
  const fittedIntercept = fixed ? null : makeEstimate(line.intercept, line.interceptStandardError, df);
  const runs = line.signRuns
    ? runsTestFromCounts(line.signRuns.runs, line.signRuns.positives, line.signRuns.negatives)
    : residualRunsTest(residualsInConcentrationOrder(concentrations, line.residuals));
  const diagnosis = classifyCurvature(line, line.quadratic, runs);
  const rSquaredCentred = fixed ? centredRSquared(ratios, line.residualSumOfSquares, weights) : line.rSquared;
  const kSv = makeEstimate(line.slope, line.slopeStandardError, df);
  const pointFlags = ratioFlags(
    concentrations,
    ratios,
    ratioUncertainties,
    line.residualStandardDeviation,
    kSv,
    rSquaredCentred,
  );
  return {
    intercept,
    kSv,
    fittedIntercept,
    rSquared: line.rSquared,
    rSquaredDefinition: fixed ? 'uncentred' : 'centred',
    rSquaredCentred,
    residuals: line.residuals,
    residualStandardDeviation: line.residualStandardDeviation,
    residualSumOfSquares: line.residualSumOfSquares,
    degreesOfFreedom: df,
    n: line.n,
    distinctConcentrations,
    weighted: weights !== undefined,
    points: { concentrations, ratios },
    diagnosis,
    flags: [...sternVolmerFlags(distinctConcentrations, fittedIntercept, diagnosis), ...pointFlags],
  };
}

// An intercept more than this many standard errors from 1 is flagged (common practice: well beyond
// the scatter a correct blank would give).
const INTERCEPT_FLAG_STANDARD_ERRORS = 3;

/** 1 - SS_res / sum w (y - ybar_w)^2 for a line whose residual sum of squares is known. */
function centredRSquared(y: readonly number[], residualSumOfSquares: number, weights?: ArrayLike<number>): number {
  let sumW = 0;
  let sumWy = 0;
  // weights (when given) has y.length entries (checked by the caller), so every index exists.
  for (let i = 0; i < y.length; i++) {
    const w = weights ? weights[i]! : 1;
    sumW += w;
    sumWy += w * y[i]!;
  }
  const mean = sumWy / sumW;
  let total = 0;
  for (let i = 0; i < y.length; i++) total += (weights ? weights[i]! : 1) * (y[i]! - mean) ** 2;
  return total > 0 ? 1 - residualSumOfSquares / total : 1;
}

/**
 * Flags on the series as a whole: centred R² below R_SQUARED_FLAG_BELOW, a relative SE of K_SV
 * above KSV_RELATIVE_SE_FLAG_ABOVE, and ratios below 1 by more than their standard uncertainty
 * (the point's own when given, else the residual standard deviation of the line).
 */
function ratioFlags(
  concentrations: readonly number[],
  ratios: readonly number[],
  uncertainties: readonly number[] | undefined,
  residualStandardDeviation: number,
  kSv: ParameterEstimate,
  rSquaredCentred: number,
): QualityFlag[] {
  const flags: QualityFlag[] = [];
  if (rSquaredCentred < R_SQUARED_FLAG_BELOW)
    flags.push(
      qualityFlag('LOW_R_SQUARED', `centred R² ${rSquaredCentred.toFixed(3)} (below ${R_SQUARED_FLAG_BELOW})`),
    );
  const relative = kSv.standardError / Math.abs(kSv.value);
  if (!(relative <= KSV_RELATIVE_SE_FLAG_ABOVE))
    flags.push(qualityFlag('KSV_UNCERTAIN', `standard error ${(relative * 100).toFixed(0)} % of K_SV`));
  const below = ratios.flatMap((ratio, i) => {
    const u = uncertainties?.[i] ?? residualStandardDeviation;
    return ratio + u < 1
      ? [`point ${i + 1} ([Q] ${concentrations[i]!.toPrecision(3)} M): ${ratio.toFixed(3)} ± ${u.toPrecision(2)}`]
      : [];
  });
  if (below.length > 0) flags.push(qualityFlag('RATIO_BELOW_ONE', below.join('; ')));
  return flags;
}

function sternVolmerFlags(
  distinct: number,
  intercept: ParameterEstimate | null,
  diagnosis: CurvatureDiagnosis,
): QualityFlag[] {
  const flags: QualityFlag[] = [];
  if (distinct < RECOMMENDED_DISTINCT_CONCENTRATIONS) {
    flags.push(qualityFlag('FEW_CONCENTRATIONS', `${distinct} distinct concentrations`));
  }
  if (intercept) {
    const { value, standardError, interval95 } = intercept;
    if (Math.abs(value - 1) > INTERCEPT_FLAG_STANDARD_ERRORS * standardError) {
      flags.push(
        qualityFlag(
          'INTERCEPT_FAR_FROM_ONE',
          `intercept ${value.toPrecision(3)}, ${(Math.abs(value - 1) / standardError).toFixed(1)} standard errors from 1 (95 % interval ${interval95.lower.toPrecision(3)} to ${interval95.upper.toPrecision(3)})`,
        ),
      );
    }
  }
  if (diagnosis.shape !== 'linear') {
    const pValue = `F-test p = ${diagnosis.fTest?.pValue.toPrecision(2)}`;
    flags.push(qualityFlag(diagnosis.shape === 'upward' ? 'UPWARD_CURVATURE' : 'DOWNWARD_CURVATURE', pValue));
  }
  if (diagnosis.shape === 'linear' && diagnosis.residualPattern) {
    flags.push(
      qualityFlag(
        'RESIDUAL_PATTERN',
        `${diagnosis.runs.runs} runs where about ${diagnosis.runs.expectedRuns.toFixed(1)} are expected`,
      ),
    );
  }
  return flags;
}
