import type { FitResult } from '../../schemas/study-fits';
import type { SternVolmerFit } from '../stern-volmer/fit-stern-volmer';

/** The statistics a study fit reports for a straight Stern–Volmer line (intensity or lifetime). */
export function lineStatistics(fit: SternVolmerFit): FitResult['statistics'] {
  return {
    n: fit.n,
    degreesOfFreedom: fit.degreesOfFreedom,
    rSquared: fit.rSquared,
    rSquaredDefinition: fit.rSquaredDefinition,
    rSquaredCentred: fit.rSquaredCentred,
    residualStandardDeviation: fit.residualStandardDeviation,
    curvature: fit.diagnosis.shape,
    curvaturePValue: fit.diagnosis.fTest?.pValue ?? null,
  };
}
