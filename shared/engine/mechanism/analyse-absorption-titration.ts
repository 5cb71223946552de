import { EngineError } from '../core/engine-error';
import { countDistinct, requirePositive } from '../core/validate';
import { normalUpperQuantile } from '../stats/normal-upper-quantile';
import { makeEstimate, type ParameterEstimate } from '../stats/parameter-estimate';
import { secondDifferenceNoise } from '../stats/second-difference-noise';
import { absorptionDifferences, type AbsorptionDifferenceInput } from './absorption-differences';
import { compareAssociationConstants, type AssociationAgreement } from './compare-association-constants';
import { fitBenesiHildebrand, type BenesiHildebrandFit } from './fit-benesi-hildebrand';
import { fitBindingIsotherm, type BindingIsothermFit } from './fit-binding-isotherm';
import { spectralBands } from './spectral-bands';

export interface AbsorptionBand {
  /** nm */
  start: number;
  end: number;
  centre: number;
  /** mean absorbance of the blank in the band */
  blank: number;
  /** mean ΔA in the band, one per spectrum (quencher's own absorbance removed) */
  changes: number[];
  /** the largest |ΔA| / σ of any spectrum in the band */
  largestZ: number;
  /** some spectrum changes here beyond the threshold */
  changed: boolean;
}

/** A fit that could not be made says why instead. */
export interface Attempt<T> {
  fit: T | null;
  problem: string | null;
}

export interface AbsorptionBinding {
  /** the band of largest change at the highest [Q] */
  band: { start: number; end: number; centre: number };
  /** mean corrected absorbance in the band, one per spectrum */
  signals: number[];
  /** mean ΔA in the band, one per spectrum */
  changes: number[];
  benesiHildebrand: Attempt<BenesiHildebrandFit>;
  isotherm: Attempt<BindingIsothermFit>;
  /** M^-1 cm^-1, Δε = ΔA∞ / (l [E]0) of the isotherm; null without [E]0 or the isotherm */
  deltaEpsilon: ParameterEstimate | null;
}

export interface AbsorptionComparison {
  /** M^-1, K_S of the study's combined static+dynamic fit */
  kS: ParameterEstimate;
  benesiHildebrand: AssociationAgreement | null;
  isotherm: AssociationAgreement | null;
}

export type AbsorptionFlagCode = 'ABSORPTION_CHANGES';

export interface AbsorptionFlag {
  code: AbsorptionFlagCode;
  title: string;
  detail: string;
}

export interface AbsorptionTitrationAnalysis {
  /** cm */
  pathLength: number;
  /** nm (0: one band per wavelength) */
  bandWidth: number;
  /** mol/L, or null when not given */
  emitterConcentration: number | null;
  quencherCorrection: 'none' | 'absorptivity' | 'spectrum';
  /** mol/L, one per spectrum */
  concentrations: number[];
  /** one per spectrum: noise SD of one reading of its difference spectrum (absorbance) */
  noiseLevels: number[];
  /** a change counts beyond |ΔA|/σ > z, the Bonferroni bound for `tests` tests at the family level */
  threshold: { familyLevel: number; tests: number; z: number };
  bands: AbsorptionBand[];
  /** the band-mean change of largest size at the highest [Q], with its size in noise SDs */
  largestChange: { start: number; end: number; centre: number; change: number; z: number };
  /** null when nothing changes beyond the noise (no complex to fit) */
  binding: AbsorptionBinding | null;
  /** null without K_S or without a fitted K_a */
  comparison: AbsorptionComparison | null;
  flags: AbsorptionFlag[];
  /** plain-words caveats (quencher not subtracted, Benesi–Hildebrand outside its excess condition, ...) */
  notes: string[];
}

export interface AbsorptionTitrationInput extends AbsorptionDifferenceInput {
  /** nm, ≥ 0; 0 for one band per wavelength */
  bandWidth: number;
  /** [E]0, mol/L: the exact 1:1 isotherm and Δε; without it the excess form */
  emitterConcentration?: number;
  /** K_S (M^-1) of the study's combined static+dynamic fit, to compare with */
  staticConstant?: ParameterEstimate;
}

/** Family-wise false-flag rate of the change test over all bands and spectra (our choice). */
export const ABSORPTION_FAMILY_LEVEL = 0.01;
/** Benesi–Hildebrand wants [Q] ≫ [E]0; below this ratio at the lowest [Q] we say so (common practice). */
export const BENESI_HILDEBRAND_EXCESS = 10;
const MIN_WAVELENGTHS = 5;

function attempt<T>(run: () => T): Attempt<T> {
  try {
    return { fit: run(), problem: null };
  } catch (error) {
    if (error instanceof EngineError) return { fit: null, problem: error.message };
    throw error;
  }
}

const nm = (band: { start: number; end: number }) =>
  band.start === band.end ? `${band.start} nm` : `${band.start}–${band.end} nm`;

/**
 * Absorption evidence for a ground-state complex between emitter and quencher (static
 * quenching through a non-emitting complex: Lakowicz, Principles of Fluorescence Spectroscopy,
 * 3rd ed., ch. 8, where a changed absorption spectrum is the usual sign). The quencher's own
 * absorbance is taken out and each spectrum compared with the blank (absorptionDifferences).
 * Noise: each difference spectrum's own second differences (secondDifferenceNoise: 1.4826 ×
 * median |Δ²| / √6), so the blank's and the quencher reference's noise are in it and the smooth
 * bands cancel; a band mean of r readings has σ/√r. A band changes when |ΔA| / σ exceeds the
 * two-sided Bonferroni bound z = Φ⁻¹(1 − α/2N) over all N band × spectrum tests at α = 1 %.
 * Where something changes, the band of largest |ΔA| at the highest [Q] gives K_a twice: by the
 * Benesi–Hildebrand double reciprocal (fitBenesiHildebrand, with the blank's band noise as the
 * error of the common reference) and by the 1:1 isotherm
 * (fitBindingIsotherm, exact with [E]0); with K_S from the study both are compared with it
 * (compareAssociationConstants).
 *
 * @throws EngineError those of absorptionDifferences and spectralBands; TOO_FEW_POINTS (fewer than 5 wavelengths), TOO_FEW_CONCENTRATIONS (fewer than 3 distinct [Q] above 0)
 * @example analyseAbsorptionTitration({ wavelengths, concentrations: [0, 0.005, 0.01, 0.02], spectra, pathLength: 1, bandWidth: 5 }).flags // [] when nothing changes
 */
export function analyseAbsorptionTitration(input: AbsorptionTitrationInput): AbsorptionTitrationAnalysis {
  const { wavelengths, concentrations, pathLength, bandWidth, emitterConcentration, staticConstant } = input;
  if (wavelengths.length < MIN_WAVELENGTHS)
    throw new EngineError(
      'TOO_FEW_POINTS',
      'wavelengths',
      `the noise is read from the spectra's second differences, which needs at least ${MIN_WAVELENGTHS} wavelengths, got ${wavelengths.length}`,
    );
  if (emitterConcentration !== undefined)
    requirePositive(
      emitterConcentration,
      'emitterConcentration',
      'Give the emitter concentration in mol/L, or leave it out',
    );
  const { blank, corrected, differences } = absorptionDifferences(input);
  const quenched = concentrations.flatMap((q, j) => (q > 0 ? [j] : []));
  const distinct = countDistinct(quenched.map((j) => concentrations[j]!));
  if (distinct < 3)
    throw new EngineError(
      'TOO_FEW_CONCENTRATIONS',
      'concentrations',
      `an absorption titration needs spectra at 3 or more different quencher concentrations above 0, got ${distinct}`,
      'Add spectra at more quencher concentrations',
    );
  // Rounding floor: a difference spectrum that is exactly smooth (noise-free data) still gets a finite σ.
  const scale = Math.max(...corrected.flatMap((spectrum) => spectrum.map(Math.abs)));
  const floor = 64 * Number.EPSILON * Math.max(scale, 1);
  const noiseLevels = differences.map((difference) => secondDifferenceNoise(difference));
  const raw = spectralBands(wavelengths, differences, bandWidth);
  const blankBands = spectralBands(wavelengths, [blank], bandWidth);
  const tests = raw.length * quenched.length;
  const z = normalUpperQuantile(ABSORPTION_FAMILY_LEVEL / (2 * tests));
  const readingsIn = (band: { start: number; end: number }) =>
    wavelengths.filter((wl) => wl >= band.start && wl <= band.end).length;
  const bands: AbsorptionBand[] = raw.map((band, b) => {
    const readings = readingsIn(band);
    const changes = band.intensities.map((sum) => sum / readings);
    const zs = quenched.map((j) => Math.abs(changes[j]!) / (Math.max(noiseLevels[j]!, floor) / Math.sqrt(readings)));
    const largestZ = Math.max(...zs);
    return {
      start: band.start,
      end: band.end,
      centre: band.centre,
      blank: blankBands[b]!.intensities[0]! / readings,
      changes,
      largestZ,
      changed: largestZ > z,
    };
  });
  const top = Math.max(...quenched.map((j) => concentrations[j]!));
  const atTop = quenched.filter((j) => concentrations[j] === top);
  const sizeAtTop = (band: AbsorptionBand) => Math.max(...atTop.map((j) => Math.abs(band.changes[j]!)));
  const largest = bands.reduce((best, band) => (sizeAtTop(band) > sizeAtTop(best) ? band : best));
  const largestJ = atTop.reduce((best, j) =>
    Math.abs(largest.changes[j]!) > Math.abs(largest.changes[best]!) ? j : best,
  );
  const largestChange = {
    start: largest.start,
    end: largest.end,
    centre: largest.centre,
    change: largest.changes[largestJ]!,
    z:
      Math.abs(largest.changes[largestJ]!) / (Math.max(noiseLevels[largestJ]!, floor) / Math.sqrt(readingsIn(largest))),
  };

  const notes: string[] = [];
  if (!input.quencher)
    notes.push(
      "The quencher's own absorbance was not subtracted: where it absorbs, its share shows as change. Upload its spectrum to take it out.",
    );
  const flags: AbsorptionFlag[] = [];
  const changedBands = bands.filter((band) => band.changed);
  let binding: AbsorptionBinding | null = null;
  if (changedBands.length > 0) {
    flags.push({
      code: 'ABSORPTION_CHANGES',
      title: 'The absorption changes beyond the sum of the parts: a ground-state complex may form',
      detail: `At ${changedBands.length} of ${bands.length} bands the spectrum with quencher differs from emitter plus quencher by more than ${z.toPrecision(3)} noise SDs (the 1 % bound over ${tests} tests); the largest change, ΔA = ${largestChange.change.toPrecision(3)} at ${nm(largest)}, is ${largestChange.z.toPrecision(3)} noise SDs.`,
    });
    const readings = readingsIn(largest);
    const signals = corrected.map(
      (spectrum) =>
        wavelengths.reduce((sum, wl, i) => (wl >= largest.start && wl <= largest.end ? sum + spectrum[i]! : sum), 0) /
        readings,
    );
    // The blank's own noise (its second differences) as a band mean: it moves every ΔA of the band together.
    const blankError = Math.max(secondDifferenceNoise(blank), floor) / Math.sqrt(readings);
    const benesiHildebrand = attempt(() => fitBenesiHildebrand(concentrations, largest.changes, blankError));
    const isotherm = attempt(() =>
      fitBindingIsotherm({
        concentrations,
        signals,
        ...(emitterConcentration !== undefined ? { emitterConcentration } : {}),
      }),
    );
    const deltaEpsilon =
      isotherm.fit && emitterConcentration !== undefined
        ? makeEstimate(
            isotherm.fit.limitingChange.value / (pathLength * emitterConcentration),
            isotherm.fit.limitingChange.standardError / (pathLength * emitterConcentration),
            isotherm.fit.degreesOfFreedom,
          )
        : null;
    binding = {
      band: { start: largest.start, end: largest.end, centre: largest.centre },
      signals,
      changes: largest.changes,
      benesiHildebrand,
      isotherm,
      deltaEpsilon,
    };
    const lowest = Math.min(...quenched.map((j) => concentrations[j]!));
    if (emitterConcentration !== undefined && lowest < BENESI_HILDEBRAND_EXCESS * emitterConcentration)
      notes.push(
        `Benesi–Hildebrand assumes the quencher in large excess, but the lowest [Q] is only ${(lowest / emitterConcentration).toPrecision(2)} times [E]0: trust the isotherm, which uses the exact 1:1 balance.`,
      );
    if (emitterConcentration === undefined)
      notes.push(
        'Without the emitter concentration the isotherm takes [Q] as free quencher (large excess); give [E]0 for the exact form.',
      );
  }
  const comparison =
    staticConstant && binding && (binding.benesiHildebrand.fit || binding.isotherm.fit)
      ? {
          kS: staticConstant,
          benesiHildebrand: binding.benesiHildebrand.fit
            ? compareAssociationConstants(binding.benesiHildebrand.fit.kA, staticConstant)
            : null,
          isotherm: binding.isotherm.fit ? compareAssociationConstants(binding.isotherm.fit.kA, staticConstant) : null,
        }
      : null;
  return {
    pathLength,
    bandWidth,
    emitterConcentration: emitterConcentration ?? null,
    quencherCorrection: input.quencher?.kind ?? 'none',
    concentrations: [...concentrations],
    noiseLevels,
    threshold: { familyLevel: ABSORPTION_FAMILY_LEVEL, tests, z },
    bands,
    largestChange,
    binding,
    comparison,
    flags,
    notes,
  };
}
