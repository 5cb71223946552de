import { correctDilution } from '../corrections/correct-dilution';
import { correctInnerFilter } from '../corrections/correct-inner-filter';

/** The study settings the corrections read. */
export interface CorrectionSettings {
  dilutionCorrection: boolean;
  initialVolume: number | null;
  stockConcentration: number | null;
  stockContainsEmitter: boolean;
  innerFilterCorrection: boolean;
}

export interface CorrectablePoint {
  concentration: number;
  intensity: number | null;
  absorbanceExcitation: number | null;
  absorbanceEmission: number | null;
  volumeAdded: number | null;
}

export interface CorrectedValues {
  concentration: number;
  intensity: number | null;
  dilutionFactor: number | null;
  innerFilterFactor: number | null;
  /** why a switched-on correction could not be applied to this point */
  missing: string[];
}

/**
 * Applies the switched-on corrections to one point with the engine's correctDilution and
 * correctInnerFilter. With ratio data (I0/I) the ratio is divided by the factor, because
 * correcting I by a factor f turns I0/I into (I0/I)/f. Returns null when no correction is on.
 */
export function correctPoint(
  settings: CorrectionSettings,
  point: CorrectablePoint,
  isRatio: boolean,
): CorrectedValues | null {
  if (!settings.dilutionCorrection && !settings.innerFilterCorrection) return null;
  let concentration = point.concentration;
  let factor = 1;
  let dilutionFactor: number | null = null;
  let innerFilterFactor: number | null = null;
  const missing: string[] = [];
  if (settings.dilutionCorrection && settings.initialVolume && settings.stockConcentration) {
    if (point.volumeAdded === null) missing.push('volume added (for the dilution correction)');
    else {
      const [diluted] = correctDilution({
        initialVolume: settings.initialVolume,
        stockConcentration: settings.stockConcentration,
        cumulativeAddedVolumes: [point.volumeAdded],
        intensities: [1],
        stockContainsEmitter: settings.stockContainsEmitter,
      });
      concentration = diluted!.concentration;
      dilutionFactor = diluted!.dilutionFactor;
      factor *= diluted!.correctedIntensity ?? 1;
    }
  }
  if (settings.innerFilterCorrection) {
    if (point.absorbanceExcitation === null || point.absorbanceEmission === null) {
      missing.push('absorbances at both wavelengths (for the inner-filter correction)');
    } else {
      innerFilterFactor = correctInnerFilter({
        intensity: 1,
        absorbanceExcitation: point.absorbanceExcitation,
        absorbanceEmission: point.absorbanceEmission,
      }).factor;
      factor *= innerFilterFactor;
    }
  }
  const intensity = point.intensity === null ? null : isRatio ? point.intensity / factor : point.intensity * factor;
  return { concentration, intensity, dilutionFactor, innerFilterFactor, missing };
}
