import { engineFlag, type EngineFlag, type FlagText } from './engine-flag';

/** The warnings the engine attaches to results. Codes are stable; texts are for people. */
export const QUALITY_FLAG_CODES = [
  'KQ_ABOVE_DIFFUSION_LIMIT',
  'INTERCEPT_FAR_FROM_ONE',
  'FEW_CONCENTRATIONS',
  'UPWARD_CURVATURE',
  'DOWNWARD_CURVATURE',
  'RESIDUAL_PATTERN',
  'NON_POSITIVE_INTENSITY',
  'NO_I0',
  'INNER_FILTER_LARGE',
  'LARGE_DILUTION',
  'LIFETIME_STEEPER_THAN_INTENSITY',
  'LOW_R_SQUARED',
  'KSV_UNCERTAIN',
  'RATIO_BELOW_ONE',
  'QUENCHER_ABSORBS_UNCORRECTED',
] as const;
export type QualityFlagCode = (typeof QUALITY_FLAG_CODES)[number];

export type QualityFlag = EngineFlag<QualityFlagCode>;

/** A centred R² below this is flagged (a stated threshold of common practice for a Stern–Volmer line, not a test). */
export const R_SQUARED_FLAG_BELOW = 0.98;
/** A relative standard error of K_SV above this (10 %) is flagged (common practice). */
export const KSV_RELATIVE_SE_FLAG_ABOVE = 0.1;

const FLAG_TEXTS: Record<QualityFlagCode, FlagText> = {
  KQ_ABOVE_DIFFUSION_LIMIT: {
    title: 'Rate constant faster than diffusion',
    explanation:
      'Two molecules in solution cannot meet more often than diffusion allows, so a bimolecular quenching constant above the diffusion limit means something besides collisions during the excited-state lifetime lowers the signal.',
    whatToCheck: [
      'a ground-state complex between emitter and quencher (static quenching): compare with lifetime data',
      'the unquenched lifetime tau0 used for kq (solvent, degassing, temperature)',
      'quencher absorbance at the excitation or emission wavelength (inner filter)',
      'aggregation or precipitation of the emitter at higher quencher concentration',
    ],
    whatToDo:
      'Measure lifetimes over the same range: if τ0/τ stays below I0/I, fit the combined static and dynamic model and take K_D, not K_SV, as the collisional part.',
  },
  INTERCEPT_FAR_FROM_ONE: {
    title: 'Intercept differs from 1',
    explanation:
      'At zero quencher the ratio must be exactly 1. A fitted intercept clearly away from 1 means the reference value or some points do not belong to the same straight line.',
    whatToCheck: [
      'the I0 (or tau0) value and the blank measurements it came from',
      'drift of lamp or detector during the titration',
      'curvature at the high-concentration end pulling the line',
    ],
    whatToDo:
      'Re-measure the blank (or check the entered I0), then refit; if the intercept stays away from 1, report the free-intercept fit and say why.',
  },
  FEW_CONCENTRATIONS: {
    title: 'Few quencher concentrations',
    explanation:
      'With fewer than five different concentrations the slope is poorly determined and curvature cannot be seen reliably. Fewer than three cannot be fitted at all.',
    whatToCheck: ['add concentrations spread over the range, including a blank at zero'],
    whatToDo: 'Add concentrations until at least five different ones span the range, then refit.',
  },
  UPWARD_CURVATURE: {
    title: 'Plot curves upward',
    explanation:
      'A quadratic describes the points significantly better than a line, bending upward. This is the usual sign of static and dynamic quenching together (I0/I = (1 + K_D[Q])(1 + K_S[Q])), or of a quencher absorbing light.',
    whatToCheck: [
      'lifetime data: if tau0/tau stays linear, part of the quenching is static',
      'quencher absorbance (apply the inner-filter correction)',
      'fit the combined static and dynamic model',
    ],
    whatToDo: 'Fit the combined static and dynamic model, and measure lifetimes to tell K_D from K_S.',
  },
  DOWNWARD_CURVATURE: {
    title: 'Plot curves downward',
    explanation:
      "A quadratic describes the points significantly better than a line, bending toward a plateau. Part of the emission may be out of the quencher's reach, or the emitter is a mixture.",
    whatToCheck: [
      'fit the modified Stern–Volmer plot to estimate the accessible fraction',
      'emitter purity and possible second emitting species',
      'detector saturation at the low-concentration end',
    ],
    whatToDo: 'Fit the modified Stern–Volmer plot to estimate the accessible fraction f_a.',
  },
  RESIDUAL_PATTERN: {
    title: 'Residuals follow a pattern',
    explanation:
      'Residuals of one sign come in blocks more than chance would give, so the line misses a systematic trend even though no curvature is significant.',
    whatToCheck: ['the order in which samples were measured (drift)', 'pipetting of individual additions', 'outliers'],
    whatToDo: 'Look at the residuals in measurement order and repeat the points that break the pattern.',
  },
  NON_POSITIVE_INTENSITY: {
    title: 'Zero or negative intensity',
    explanation: 'An intensity at or below zero cannot be turned into a ratio I0/I; the point cannot be used.',
    whatToCheck: ['background subtraction', 'the integration window or reading wavelength', 'detector settings'],
    whatToDo: 'Correct or exclude the points with zero or negative intensity before fitting.',
  },
  NO_I0: {
    title: 'No unquenched intensity',
    explanation:
      'Without a measurement at zero quencher concentration, or an I0 entered by hand, no ratio I0/I can be formed.',
    whatToCheck: [
      'include the blank (no quencher) in the series',
      'or enter I0 from a separate measurement of the same sample',
    ],
    whatToDo: 'Add a blank at zero quencher concentration, or enter I0 from a separate measurement.',
  },
  INNER_FILTER_LARGE: {
    title: 'Quencher absorbs noticeably',
    explanation:
      'The quencher absorbs enough at the excitation or emission wavelength that the inner-filter correction changes the intensity by more than a few per cent. The correction itself is an approximation that grows less reliable as absorbance rises.',
    whatToCheck: [
      'apply the correction with measured absorbances at both wavelengths',
      'lower the quencher range, use a shorter path or excite where the quencher is transparent',
    ],
    whatToDo:
      'Lower the quencher range or use a shorter path so the correction stays small, and report that it was applied.',
  },
  LARGE_DILUTION: {
    title: 'Sample diluted by more than about 10 %',
    explanation:
      'The additions change the volume enough that the emitter concentration drops noticeably, which lowers the signal independently of quenching.',
    whatToCheck: ['put the emitter in the quencher stock at the same concentration', 'use a more concentrated stock'],
    whatToDo:
      'Switch the dilution correction on (with the volumes of each addition), or redo the titration with the emitter in the quencher stock.',
  },
  LIFETIME_STEEPER_THAN_INTENSITY: {
    title: 'Lifetime plot steeper than intensity plot',
    explanation:
      'Quenching cannot shorten the lifetime more than it lowers the intensity, so this points to a problem in one of the two data sets.',
    whatToCheck: [
      'I0 and tau0 reference values',
      'fitting of the decays (background, instrument response)',
      'that both series used the same samples',
    ],
    whatToDo: 'Check I0 and τ0 and the decay fits, then refit both series from the same samples.',
  },
  LOW_R_SQUARED: {
    title: 'Points scatter widely about the line',
    explanation: `The centred R² is below ${R_SQUARED_FLAG_BELOW}: the line explains too little of the spread of the ratios for K_SV to describe the series well.`,
    whatToCheck: [
      'outliers or mislabelled concentrations',
      'curvature hidden by scatter',
      'the noise of the intensity readings',
    ],
    whatToDo:
      'Look at the plot for outliers or curvature; repeat doubtful points or fit a curved model before using K_SV.',
  },
  KSV_UNCERTAIN: {
    title: 'K_SV poorly determined',
    explanation: `The standard error of K_SV is more than ${KSV_RELATIVE_SE_FLAG_ABOVE * 100} % of its value, so the constant (and kq) are known only roughly.`,
    whatToCheck: [
      'the range of concentrations (a narrow range gives a poorly determined slope)',
      'scatter of the points',
      'the number of points',
    ],
    whatToDo:
      'Add replicates and concentrations toward the upper end of the range, then refit; report K_SV with its interval.',
  },
  RATIO_BELOW_ONE: {
    title: 'Quenched sample brighter than the blank',
    explanation:
      'A ratio I0/I below 1 by more than its uncertainty means the sample with quencher emitted more than the one without, which quenching cannot do.',
    whatToCheck: [
      'the blank (I0) and its replicates',
      'background subtraction and lamp drift',
      'the concentrations of the named points',
    ],
    whatToDo:
      'Check the blank and the intensity of the named points (background, lamp drift, pipetting), then re-measure them or exclude them with a reason.',
  },
  QUENCHER_ABSORBS_UNCORRECTED: {
    title: 'Quencher absorbs at the excitation wavelength, no correction',
    explanation:
      'The samples absorb at the excitation wavelength enough to lower the signal by more than 2 %, and the inner-filter correction is off, so part of that drop is counted as quenching.',
    whatToCheck: [
      'the absorbance of the quencher alone at the excitation and emission wavelengths',
      'the path length used for the absorbances',
    ],
    whatToDo:
      'Switch the inner-filter correction on with the measured absorbances, or excite where the quencher does not absorb.',
  },
};

/**
 * Builds a quality flag with the engine's explanation and check-list.
 *
 * @param code - which flag
 * @param detail - optional numbers that raised it
 * @param severity - 'warning' unless the result cannot be used
 * @example qualityFlag('FEW_CONCENTRATIONS', '4 distinct concentrations').title // 'Few quencher concentrations'
 */
export function qualityFlag(
  code: QualityFlagCode,
  detail?: string,
  severity: 'warning' | 'error' = 'warning',
): QualityFlag {
  return engineFlag(FLAG_TEXTS, code, detail, severity);
}
