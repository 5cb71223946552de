import { engineFlag, type EngineFlag, type FlagText } from '../flags/engine-flag';

/** The warnings a decay fit carries. Codes are stable; texts are for people. */
export type DecayFlagCode =
  | 'CHI_SQUARED_FAR_FROM_ONE'
  | 'STRUCTURED_RESIDUALS'
  | 'RESPONSE_TOO_WIDE'
  | 'FEW_PEAK_COUNTS'
  | 'PILE_UP_RISK'
  | 'LIFETIME_WITHIN_FEW_CHANNELS'
  | 'COMPONENT_NOT_SUPPORTED'
  | 'NOT_CONVERGED'
  | 'COUNTS_NOT_WHOLE';

/** Same shape as the Stern–Volmer flags (QualityFlag), with the decay codes. */
export type DecayFlag = EngineFlag<DecayFlagCode>;

const TEXTS: Record<DecayFlagCode, FlagText> = {
  CHI_SQUARED_FAR_FROM_ONE: {
    title: 'Reduced chi-squared far from 1',
    explanation:
      'With counting noise alone, the reduced chi-squared of a correct model is close to 1. A value well above means the model misses something in the data; well below, that the counts are not raw photon counts.',
    whatToCheck: [
      'one more exponential, or a different fit range',
      'whether the file holds raw counts (not normalised, smoothed or background-subtracted data)',
      'the instrument response: same wavelength setting, same count rate, same time range',
    ],
    whatToDo:
      'Refit with one more exponential or another fit range, and use the raw counts if the file holds processed data.',
  },
  STRUCTURED_RESIDUALS: {
    title: 'Residuals are not random',
    explanation:
      'The weighted residuals come in runs of one sign, or neighbouring channels move together. Random counting noise does not do that: the model leaves a systematic part of the decay unexplained.',
    whatToCheck: [
      'the residual and autocorrelation plots under the decay',
      'one more exponential, a shift of the response, or a later start channel',
      'scattered excitation light or a rising component near the start',
    ],
    whatToDo:
      'Try one more exponential, a response shift or a later start channel, and keep the fit whose residuals scatter evenly.',
  },
  RESPONSE_TOO_WIDE: {
    title: 'Response too wide for this lifetime',
    explanation:
      'The shortest lifetime is small against the width of the instrument response, so the number rests on the exact shape of the measured response rather than on the decay itself.',
    whatToCheck: [
      'reconvolution instead of a tail fit',
      'a response recorded under the same conditions as the decay (wavelength, count rate)',
      'a faster excitation source or detector for lifetimes this short',
    ],
    whatToDo:
      'Fit by reconvolution with a response recorded under the same conditions, or measure with a faster source or detector.',
  },
  FEW_PEAK_COUNTS: {
    title: 'Few counts in the peak',
    explanation:
      'The decay holds few counts, so the lifetimes carry large errors and extra exponentials cannot be told apart. Common practice collects about 10,000 counts in the peak channel for multi-exponential work.',
    whatToCheck: ['collect for longer, or at a higher count rate while staying below the pile-up limit'],
    whatToDo: 'Collect the decay again for longer, aiming at about 10,000 counts in the peak channel.',
  },
  PILE_UP_RISK: {
    title: 'Count rate near pile-up',
    explanation:
      'Above a few per cent of the repetition rate, a single-photon counter misses the later photon of a pulse often enough to shorten the measured decay (pulse pile-up).',
    whatToCheck: ['lower the count rate (neutral density filter, slit) to about 1-2 % of the repetition rate'],
    whatToDo: 'Measure again at about 1-2 % of the repetition rate, with a neutral density filter or narrower slits.',
  },
  LIFETIME_WITHIN_FEW_CHANNELS: {
    title: 'Lifetime within a few channels',
    explanation:
      'The shortest lifetime spans only a few channels of the histogram, so the time axis cannot resolve it well.',
    whatToCheck: ['a shorter time range (narrower channels) for this sample'],
    whatToDo: 'Measure again over a shorter time range so the decay spans more channels.',
  },
  COMPONENT_NOT_SUPPORTED: {
    title: 'A component went to zero',
    explanation:
      'The fit drove the amplitude of one exponential to zero: the data do not support this many exponentials.',
    whatToCheck: ['fit with one exponential fewer'],
    whatToDo: 'Fit again with one exponential fewer.',
  },
  NOT_CONVERGED: {
    title: 'Fit did not settle',
    explanation:
      'The fit stopped at its iteration limit before the parameters stopped changing; the numbers may not be the best ones.',
    whatToCheck: ['fewer exponentials', 'another start channel or fit range'],
    whatToDo: 'Fit again with fewer exponentials or another start channel or range before using the numbers.',
  },
  COUNTS_NOT_WHOLE: {
    title: 'Counts are not whole numbers',
    explanation:
      'Photon counts are whole numbers. Fractions suggest the file holds scaled, averaged or background-subtracted data, for which Poisson statistics and the standard errors do not hold.',
    whatToCheck: ['export the raw histogram from the instrument program'],
    whatToDo: 'Export the raw photon-count histogram from the instrument and upload that file instead.',
  },
};

/**
 * A decay flag with its standard texts.
 * @example decayFlag('FEW_PEAK_COUNTS', 'peak 1,200 counts').title // 'Few counts in the peak'
 */
export function decayFlag(code: DecayFlagCode, detail?: string, severity: 'warning' | 'error' = 'warning'): DecayFlag {
  return engineFlag(TEXTS, code, detail, severity);
}
