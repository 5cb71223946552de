import { EngineError } from '../core/engine-error';
import { countDistinct, requireNonNegativeArray, requirePositiveArray, requireSameLength } from '../core/validate';
import { fitLine } from '../stats/fit-line';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { referenceFromBlanks, type ReferenceValue } from './reference-from-blanks';

export interface ModifiedSternVolmerFit {
  /** fraction of the emission accessible to the quencher, f_a (dimensionless) */
  accessibleFraction: ParameterEstimate;
  /** Stern–Volmer constant of the accessible part, K, M^-1 */
  kSv: ParameterEstimate;
  /** the straight line I0/(I0 - I) = slope / [Q] + intercept */
  line: { slope: ParameterEstimate; intercept: ParameterEstimate; rSquared: number; residuals: number[] };
  i0: ReferenceValue;
  degreesOfFreedom: number;
  n: number;
}

/**
 * Modified Stern–Volmer plot for partly accessible emitters (Lehrer, Biochemistry 1971,
 * 10, 3254; Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., ch. 8):
 * I0/(I0 - I) = 1/(f_a K [Q]) + 1/f_a, a straight line in 1/[Q] with intercept 1/f_a
 * and slope 1/(f_a K). So f_a = 1/intercept and K = intercept/slope; their standard
 * errors come from first-order propagation including the slope–intercept covariance
 * (intervals are then value -+ t SE, approximate). Points at [Q] = 0 only supply I0.
 *
 * @param input.concentrations - [Q] in mol/L (>= 0; at least 3 distinct non-zero)
 * @param input.intensities - intensities (> 0, below I0 wherever [Q] > 0)
 * @param input.i0 - optional unquenched intensity, else the mean at [Q] = 0
 * @throws EngineError MISSING_I0, TOO_FEW_CONCENTRATIONS, MODEL_NOT_APPLICABLE (I >= I0 at some [Q] > 0, or a non-positive intercept or slope)
 * @example fitModifiedSternVolmer({ concentrations: [0, 1e-3, 2e-3, 4e-3], intensities: [100, 62.5, 50, 40] }).accessibleFraction.value // 0.75 (K = 1000)
 */
export function fitModifiedSternVolmer(input: {
  concentrations: readonly number[];
  intensities: readonly number[];
  i0?: number;
}): ModifiedSternVolmerFit {
  const { concentrations, intensities } = input;
  requireSameLength(concentrations, intensities, 'concentrations', 'intensities');
  requireNonNegativeArray(concentrations, 'concentrations');
  requirePositiveArray(intensities, 'intensities');
  const i0 = referenceFromBlanks(concentrations, intensities, input.i0, { field: 'i0', code: 'MISSING_I0' });
  const x: number[] = [];
  const y: number[] = [];
  concentrations.forEach((concentration, i) => {
    if (concentration === 0) return;
    const quenched = i0.value - intensities[i]!; // same length as concentrations (checked above)
    if (!(quenched > 0)) {
      throw new EngineError(
        'MODEL_NOT_APPLICABLE',
        `intensities[${i}]`,
        `is not below I0 (${intensities[i]} vs ${i0.value}), so I0/(I0 - I) is undefined`,
        'The modified plot needs quenched points only; check I0',
      );
    }
    x.push(1 / concentration);
    y.push(i0.value / quenched);
  });
  if (countDistinct(x) < 3) {
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      'the modified plot needs at least 3 distinct non-zero concentrations',
    );
  }
  const line = fitLine(x, y);
  const { slope, intercept } = line;
  if (!(intercept > 0) || !(slope > 0)) {
    throw new EngineError(
      'MODEL_NOT_APPLICABLE',
      'intensities',
      `the modified plot gives intercept ${intercept.toPrecision(3)} and slope ${slope.toPrecision(3)}; both must be positive`,
      'The data do not show a partly accessible emitter',
    );
  }
  const df = line.degreesOfFreedom;
  const seA = line.interceptStandardError;
  const seB = line.slopeStandardError;
  const k = intercept / slope;
  // var(a/b) = (a/b)^2 [var a / a^2 + var b / b^2 - 2 cov(a,b) / (a b)]
  const kVariance =
    k *
    k *
    ((seA * seA) / (intercept * intercept) +
      (seB * seB) / (slope * slope) -
      (2 * line.slopeInterceptCovariance) / (intercept * slope));
  return {
    accessibleFraction: makeEstimate(1 / intercept, seA / (intercept * intercept), df),
    kSv: makeEstimate(k, Math.sqrt(Math.max(kVariance, 0)), df),
    line: {
      slope: makeEstimate(slope, seB, df),
      intercept: makeEstimate(intercept, seA, df),
      rSquared: line.rSquared,
      residuals: line.residuals,
    },
    i0,
    degreesOfFreedom: df,
    n: line.n,
  };
}
