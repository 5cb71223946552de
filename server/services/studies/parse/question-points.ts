import { SimpleLinearRegression } from 'ml-regression-simple-linear';
import type { StudyPointValues } from '@shared/schemas/study-points';
import type { UploadQuestion } from '@shared/schemas/study-uploads';
import { CONCENTRATION_UNITS } from '@shared/units/units';

/** Above this a quencher concentration is more likely a unit slip than a solution (common practice). */
const HIGHEST_LIKELY_MOLAR = 1;
/** Below this K_SV (M^-1) quenching would hardly show at soluble concentrations (common practice). */
const LOWEST_LIKELY_KSV = 1;

const shown = (value: number) => String(Number(value.toPrecision(3)));

/**
 * Questions a chemist would ask of points whose unit may be wrong: a concentration above 1 M,
 * or a Stern–Volmer slope below 1 M^-1 (the slope of I0/I against [Q] by least squares,
 * ml-regression-simple-linear, with I0 the mean of the blanks). They ask; they do not refuse:
 * applying the file needs each one acknowledged.
 */
export function questionPoints(points: StudyPointValues[], intensityIsRatio: boolean): UploadQuestion[] {
  const questions: UploadQuestion[] = [];
  const highest = Math.max(...points.map((point) => point.concentration));
  if (highest > HIGHEST_LIKELY_MOLAR)
    questions.push({
      code: 'concentration_above_1_molar',
      message: `The highest concentration reads as ${shown(highest)} M. Quencher concentrations above 1 M are rare: check the concentration unit.`,
    });
  const measured = points.filter((point) => point.intensity !== null && point.intensity > 0);
  const blanks = measured.filter((point) => point.concentration === 0);
  const i0 = blanks.reduce((sum, point) => sum + point.intensity!, 0) / blanks.length;
  if (!intensityIsRatio && !(i0 > 0)) return questions;
  const ratios = measured.map((point) => (intensityIsRatio ? point.intensity! : i0 / point.intensity!));
  const concentrations = measured.map((point) => point.concentration);
  if (new Set(concentrations).size < 2) return questions;
  const kSv = new SimpleLinearRegression(concentrations, ratios).slope;
  // Had the same numbers been millimolar, each [Q] would shrink by the mM factor and K_SV grow by it.
  const kSvIfMillimolar = kSv / CONCENTRATION_UNITS.mM;
  if (kSv > 0 && kSv < LOWEST_LIKELY_KSV)
    questions.push({
      code: 'ksv_below_1_per_molar',
      message: `These points give K_SV of about ${shown(kSv)} M⁻¹ (slope of I0/I against [Q]). Below 1 M⁻¹ is rare in a quenching study: check the concentration unit (read as mM, K_SV would be ${shown(kSvIfMillimolar)} M⁻¹).`,
    });
  return questions;
}
