import { countDistinct } from '../core/validate';
import { INNER_FILTER_FLAG_THRESHOLD } from '../corrections/correct-inner-filter';
import { qualityFlag, type QualityFlag } from '../flags/quality-flag';
import { RECOMMENDED_DISTINCT_CONCENTRATIONS } from './fit-stern-volmer';

/**
 * With the inner-filter correction off, an excitation absorbance that would lower the signal by
 * more than this (2 %, through the factor 10^(A_ex/2)) is flagged (common practice).
 */
const UNCORRECTED_ABSORBANCE_FLAG = 0.02;

export interface SeriesScreen {
  /** false when a fit would refuse the series as it stands */
  fittable: boolean;
  flags: QualityFlag[];
}

/**
 * Looks over a raw quenching series before fitting, without throwing, so an upload
 * preview can show every problem at once: zero or negative intensities, too few
 * distinct concentrations (< 3 blocks the fit, < 5 warns), no I0, and points whose
 * inner-filter factor 10^((A_ex + A_em)/2) exceeds 5 %, and, when `innerFilterCorrection` is
 * false, a quencher absorbing at the excitation wavelength. Non-finite numbers count as
 * unusable intensities or are ignored as concentrations.
 *
 * @param input.concentrations - [Q], mol/L
 * @param input.intensities - observed intensities
 * @param input.i0 - optional given I0
 * @param input.absorbancesExcitation - optional A at lambda_ex per point
 * @param input.absorbancesEmission - optional A at lambda_em per point
 * @param input.innerFilterCorrection - whether the study corrects for the inner filter (false flags absorbance at lambda_ex)
 * @example screenSeries({ concentrations: [0, 1e-3, 2e-3], intensities: [100, -2, 40] }).flags.map((f) => f.code) // ['NON_POSITIVE_INTENSITY', 'FEW_CONCENTRATIONS']
 */
export function screenSeries(input: {
  concentrations: readonly number[];
  intensities: readonly number[];
  i0?: number;
  absorbancesExcitation?: readonly number[];
  absorbancesEmission?: readonly number[];
  innerFilterCorrection?: boolean;
}): SeriesScreen {
  const { concentrations, intensities, i0, absorbancesExcitation, absorbancesEmission, innerFilterCorrection } = input;
  const flags: QualityFlag[] = [];
  const bad = intensities.flatMap((value, i) => (Number.isFinite(value) && value > 0 ? [] : [i]));
  if (bad.length > 0) flags.push(qualityFlag('NON_POSITIVE_INTENSITY', `points ${bad.join(', ')}`, 'error'));
  const distinct = countDistinct(concentrations.filter(Number.isFinite));
  if (distinct < RECOMMENDED_DISTINCT_CONCENTRATIONS) {
    flags.push(
      qualityFlag('FEW_CONCENTRATIONS', `${distinct} distinct concentrations`, distinct < 3 ? 'error' : 'warning'),
    );
  }
  if (i0 === undefined && !concentrations.some((c) => c === 0)) flags.push(qualityFlag('NO_I0', undefined, 'error'));
  if (absorbancesExcitation || absorbancesEmission) {
    const large = concentrations.flatMap((_, i) => {
      const total = (absorbancesExcitation?.[i] ?? 0) + (absorbancesEmission?.[i] ?? 0);
      return 10 ** (total / 2) - 1 > INNER_FILTER_FLAG_THRESHOLD ? [i] : [];
    });
    if (large.length > 0) flags.push(qualityFlag('INNER_FILTER_LARGE', `points ${large.join(', ')}`));
  }
  if (innerFilterCorrection === false && absorbancesExcitation) {
    const highest = Math.max(0, ...absorbancesExcitation.filter(Number.isFinite));
    if (10 ** (highest / 2) - 1 > UNCORRECTED_ABSORBANCE_FLAG)
      flags.push(qualityFlag('QUENCHER_ABSORBS_UNCORRECTED', `A_ex up to ${highest.toPrecision(2)}`));
  }
  return { fittable: !flags.some((flag) => flag.severity === 'error'), flags };
}
