import { EngineError } from '../core/engine-error';
import { countDistinct, requireNonNegativeArray } from '../core/validate';
import { fitLine } from '../stats/fit-line';
import type { ParameterEstimate } from '../stats/parameter-estimate';
import { studentTQuantile975 } from '../stats/student-t';
import { testKsvHomogeneity, type KsvHomogeneity } from './ksv-homogeneity';
import { blankSpectra, requireSpectrumPerConcentration, spectralBands } from './spectral-bands';
import { spectralComponents, type SpectralComponents } from './spectral-components';
import { bandKsv } from './band-ksv';

export interface BandSternVolmer {
  /** nm */
  start: number;
  end: number;
  centre: number;
  /** summed blank reading in the band (mean of the [Q] = 0 spectra) */
  i0: number;
  /** M^-1, I0/I = 1 + K_SV [Q] with the intercept fixed at 1; null where the blank is too weak to divide by */
  kSv: ParameterEstimate | null;
  /** the band's intensity rises with [Q] beyond its uncertainty (slope of I against [Q], 95 % level) */
  rises: boolean;
}

export type SpectrumMatrixFlagCode = 'KSV_VARIES_WITH_WAVELENGTH' | 'NEW_COMPONENT_GROWS';

export interface SpectrumMatrixFlag {
  code: SpectrumMatrixFlagCode;
  title: string;
  detail: string;
}

export interface SpectrumMatrixAnalysis {
  /** nm, as asked (0: one band per wavelength) */
  bandWidth: number;
  bands: BandSternVolmer[];
  /** null when fewer than 2 bands have a K_SV */
  homogeneity: (KsvHomogeneity & { homogeneous: boolean }) | null;
  components: SpectralComponents;
  flags: SpectrumMatrixFlag[];
}

/** Bands whose blank reading is below this share of the strongest band get no K_SV (common practice: I0/I of a weak tail is mostly noise). */
export const WEAK_BAND_SHARE = 0.05;
/** K_SV counts as the same across the emission unless the χ² test rejects it at this level (our threshold). */
export const HOMOGENEITY_LEVEL = 0.01;

export interface SpectrumMatrixInput {
  /** nm, strictly increasing */
  wavelengths: readonly number[];
  /** mol/L, one per spectrum, at least one 0 (the blank) and 3 distinct values */
  concentrations: readonly number[];
  /** one per concentration, one reading per wavelength */
  spectra: readonly (readonly number[])[];
  /** nm; 0 for one band per wavelength */
  bandWidth: number;
  /** optional noise SD of one reading (else estimated from each spectrum) */
  noiseLevel?: number;
}

/** Merges neighbouring rising bands into "start–end nm" ranges for the flag text. */
function rangesOf(bands: readonly BandSternVolmer[]): string {
  const ranges: { start: number; end: number }[] = [];
  let open: { start: number; end: number } | null = null;
  for (const band of bands) {
    if (band.rises) {
      if (open) open.end = band.end;
      else open = { start: band.start, end: band.end };
    } else if (open) {
      ranges.push(open);
      open = null;
    }
  }
  if (open) ranges.push(open);
  return ranges.map((range) => `${range.start}–${range.end} nm`).join(', ');
}

/**
 * Wavelength-resolved Stern–Volmer analysis of emission spectra recorded at several quencher
 * concentrations (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006, ch. 8: one
 * emitter quenched one way has the same K_SV at every emission wavelength; a K_SV that changes
 * across the band means two emitting species, or an exciplex whose emission adds to the red).
 * In each band (spectralBands) K_SV with its SE from I0/I = 1 + K_SV [Q] (fitIntensitySternVolmer,
 * intercept fixed at 1, I0 the mean of the blanks); the χ² homogeneity test across the bands
 * (testKsvHomogeneity); the singular values of the unit-norm spectrum matrix against the noise
 * (spectralComponents); and a band whose intensity rises with [Q] (the slope of I against [Q]
 * above t(0.975) SE), which only a species that grows with the quencher can make.
 *
 * @throws EngineError LENGTH_MISMATCH, MISSING_I0, TOO_FEW_CONCENTRATIONS, INVALID_ARGUMENT, and those of spectralBands
 * @example analyseSpectrumMatrix({ wavelengths, concentrations: [0, 1e-3, 2e-3], spectra, bandWidth: 10 }).homogeneity?.pValue
 */
export function analyseSpectrumMatrix(input: SpectrumMatrixInput): SpectrumMatrixAnalysis {
  const { wavelengths, concentrations, spectra, bandWidth } = input;
  requireSpectrumPerConcentration(spectra, concentrations);
  requireNonNegativeArray(concentrations, 'concentrations');
  const blanks = blankSpectra(concentrations);
  if (countDistinct(concentrations) < 3)
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      `K_SV needs at least 3 different concentrations, got ${countDistinct(concentrations)}`,
      'Add spectra at more quencher concentrations',
    );
  const components = spectralComponents(spectra, input.noiseLevel);
  const raw = spectralBands(wavelengths, spectra, bandWidth);
  const blankOf = (intensities: readonly number[]) =>
    blanks.reduce((sum, j) => sum + intensities[j]!, 0) / blanks.length;
  const strongest = Math.max(...raw.map((band) => blankOf(band.intensities)));
  const strongestAny = Math.max(...raw.flatMap((band) => band.intensities));
  const bands: BandSternVolmer[] = raw.map((band) => {
    const i0 = blankOf(band.intensities);
    // A band of r readings sums r independent errors: its SD is σ √r for each spectrum.
    const readings = wavelengths.filter((nm) => nm >= band.start && nm <= band.end).length;
    const sigmas = components.noiseLevels.map((sigma) => sigma * Math.sqrt(readings));
    const usable = i0 >= WEAK_BAND_SHARE * strongest && band.intensities.every((value) => value > 0);
    const kSv = usable ? bandKsv(concentrations, band.intensities, sigmas) : null;
    // The trend is read wherever the band holds signal in any spectrum, so a band absent from the blank counts too.
    let rises = false;
    if (Math.max(...band.intensities) >= WEAK_BAND_SHARE * strongestAny) {
      const trend = fitLine(concentrations, band.intensities);
      rises = trend.slope > studentTQuantile975(trend.degreesOfFreedom) * trend.slopeStandardError;
    }
    return { start: band.start, end: band.end, centre: band.centre, i0, kSv, rises };
  });

  const withKsv = bands.flatMap((band) => (band.kSv && band.kSv.standardError > 0 ? [band.kSv] : []));
  const tested = withKsv.length >= 2 ? testKsvHomogeneity(withKsv) : null;
  const homogeneity = tested ? { ...tested, homogeneous: tested.pValue >= HOMOGENEITY_LEVEL } : null;

  const flags: SpectrumMatrixFlag[] = [];
  if (homogeneity && !homogeneity.homogeneous) {
    const values = withKsv.map((estimate) => estimate.value);
    flags.push({
      code: 'KSV_VARIES_WITH_WAVELENGTH',
      title: 'Two emitting species or an exciplex may be present',
      detail: `K_SV runs from ${Math.min(...values).toPrecision(3)} to ${Math.max(...values).toPrecision(3)} M⁻¹ across ${withKsv.length} bands; χ² = ${homogeneity.chiSquare.toPrecision(3)} with ${homogeneity.degreesOfFreedom} degrees of freedom, ${homogeneity.pValue < 1e-4 ? 'p < 0.0001' : `p = ${homogeneity.pValue.toPrecision(2)}`}.`,
    });
  }
  const rising = bands.filter((band) => band.rises);
  if (components.significant >= 2 && rising.length > 0)
    flags.push({
      code: 'NEW_COMPONENT_GROWS',
      title: 'A new emission grows with the quencher (exciplex or product)',
      detail: `${components.significant} spectral components stand out from the noise, and the emission rises with [Q] at ${rangesOf(bands)}.`,
    });
  return { bandWidth, bands, homogeneity, components, flags };
}
