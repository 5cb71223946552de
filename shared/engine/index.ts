/**
 * Halflight science engine: pure functions for luminescence-quenching studies.
 * Values are SI-coherent (mol/L, s, V, eV, M^-1 s^-1); convert at the edges with the
 * helpers in ../units/units. Every function throws EngineError on bad input.
 */

/** Recorded with every stored fit. */
export const ENGINE_VERSION = '1.5.0';

export { EngineError, type EngineErrorCode } from './core/engine-error';
export { approxEqual, relativeDifference } from './core/approx-equal';
export * from './core/constants';
export * from '../units/units';

export { fitLine, type LineFit } from './stats/fit-line';
export { fitLineThroughOrigin, type OriginLineFit } from './stats/fit-line-through-origin';
export { fitQuadratic, type QuadraticFit } from './stats/fit-quadratic';
export { addedQuadraticTerm, type AddedQuadraticTerm } from './stats/added-quadratic-term';
export { solveLeastSquares, type LeastSquaresSolution } from './stats/solve-least-squares';
export { studentTQuantile975, studentTTwoSidedPValue } from './stats/student-t';
export { normalCdf } from './stats/normal-cdf';
export { normalUpperQuantile } from './stats/normal-upper-quantile';
export { secondDifferenceNoise } from './stats/second-difference-noise';
export { chiSquareUpperTail } from './stats/chi-square-upper-tail';
export { singularValues } from './stats/singular-values';
export { residualRunsTest, type RunsTestResult } from './stats/runs-test';
export { extraSumOfSquaresFTest, type FTestResult } from './stats/extra-sum-of-squares-f-test';
export type { ParameterEstimate } from './stats/parameter-estimate';

export { QUALITY_FLAG_CODES, qualityFlag, type QualityFlag, type QualityFlagCode } from './flags/quality-flag';

export {
  fitSternVolmer,
  RECOMMENDED_DISTINCT_CONCENTRATIONS,
  type SternVolmerFit,
  type SternVolmerInput,
} from './stern-volmer/fit-stern-volmer';
export { fitIntensitySternVolmer, type IntensitySternVolmerFit } from './stern-volmer/fit-intensity-stern-volmer';
export { fitLifetimeSternVolmer, type LifetimeSternVolmerFit } from './stern-volmer/fit-lifetime-stern-volmer';
export { referenceFromBlanks, type ReferenceValue } from './stern-volmer/reference-from-blanks';
export { diagnoseCurvature, type CurvatureDiagnosis, type InterceptMode } from './stern-volmer/diagnose-curvature';
export { fitStaticDynamic, type StaticDynamicFit } from './stern-volmer/fit-static-dynamic';
export { fitModifiedSternVolmer, type ModifiedSternVolmerFit } from './stern-volmer/fit-modified-stern-volmer';
export { compareStaticDynamic, type StaticDynamicComparison } from './stern-volmer/compare-static-dynamic';
export { screenSeries, type SeriesScreen } from './stern-volmer/screen-series';

export { SOLVENTS, getSolvent, type SolventId, type SolventProperties } from './kinetics/solvents';
export {
  diffusionRateConstant,
  solventDiffusionLimit,
  solventDiffusionLimitAt,
  type SolventDiffusionLimit,
} from './kinetics/diffusion-rate-constant';
export { viscosityAt, type ViscosityAtTemperature, type ViscosityCorrelation } from './kinetics/viscosity-correlation';
export { quenchingRateConstant, type QuenchingRateConstant } from './kinetics/quenching-rate-constant';
export { kqFromLifetimes, type KqFromLifetimes } from './kinetics/kq-from-lifetimes';
export { quenchingFractions, type QuenchingFractions, type QuenchingShare } from './kinetics/quenching-fractions';
export { rehmWellerRateConstant, REHM_WELLER_KD_OVER_KZ } from './kinetics/rehm-weller-rate-constant';
export { fitRehmWeller, type RehmWellerFit } from './kinetics/fit-rehm-weller';

export { correctDilution, type DilutionCorrectedPoint } from './corrections/correct-dilution';
export {
  correctInnerFilter,
  INNER_FILTER_FLAG_THRESHOLD,
  type InnerFilterCorrection,
} from './corrections/correct-inner-filter';

export {
  AQUEOUS_REFERENCES,
  NON_AQUEOUS_REFERENCES,
  REFERENCE_ELECTRODES,
  type ReferenceElectrode,
  type SourcedConstant,
} from './electrochem/reference-electrodes';
export {
  convertPotential,
  type ConvertedPotential,
  type PotentialConversionInput,
  type PotentialWarning,
} from './electrochem/convert-potential';
export { e00FromWavelength, MIN_WAVELENGTH_NM, MAX_WAVELENGTH_NM } from './electrochem/e00-from-wavelength';
export { excitedStatePotentials, type ExcitedStatePotentials } from './electrochem/excited-state-potentials';
export { coulombWorkTerm, DEFAULT_ENCOUNTER_DISTANCE } from './electrochem/coulomb-work-term';
export { electronTransferDrivingForce, type DrivingForce } from './electrochem/electron-transfer-driving-force';
export {
  quenchingDrivingForces,
  type QuenchingDrivingForces,
  type QuenchingPathway,
} from './electrochem/quenching-driving-forces';
export { energyTransferFeasibility, type EnergyTransferFeasibility } from './electrochem/energy-transfer-feasibility';

export { planTitration, DILUTION_WARNING, type TitrationPlan, type TitrationStep } from './planner/plan-titration';

export {
  fitDecay,
  MIN_CHANNELS_ABOVE_BACKGROUND,
  CHI_SQUARED_BAND,
  PILE_UP_SHARE,
  PEAK_COUNTS_NEEDED,
} from './decays/fit-decay';
export { decayCurves, type DecayCurves } from './decays/decay-curves';
export { decayFlag, type DecayFlag, type DecayFlagCode } from './decays/decay-flag';
export { convolveExponential } from './decays/convolve-exponential';
export { residualAutocorrelation } from './decays/residual-autocorrelation';
export { meanLifetimes } from './decays/mean-lifetimes';
export { prepareResponse, type PreparedResponse } from './decays/prepare-response';
export { evaluateDecayModel, decayWorkspace, type DecayModelSetup } from './decays/decay-model';
export type { DecayComponent, DecayEstimate, DecayFit, DecayFitOptions, DecayInput } from './decays/decay-types';

export { fitActivation, type ActivationFit } from './mechanism/fit-activation';
export {
  analyseTemperatureSeries,
  type TemperaturePoint,
  type TemperatureSeriesAnalysis,
  type TemperatureVerdict,
} from './mechanism/analyse-temperature-series';
export { spectralBands, type SpectralBand } from './mechanism/spectral-bands';
export { testKsvHomogeneity, type KsvHomogeneity } from './mechanism/ksv-homogeneity';
export { spectralComponents, type SpectralComponents } from './mechanism/spectral-components';
export {
  analyseSpectrumMatrix,
  HOMOGENEITY_LEVEL,
  WEAK_BAND_SHARE,
  type BandSternVolmer,
  type SpectrumMatrixAnalysis,
  type SpectrumMatrixFlag,
  type SpectrumMatrixFlagCode,
  type SpectrumMatrixInput,
} from './mechanism/analyse-spectrum-matrix';
export { readMechanismPieces } from './mechanism/read-mechanism-pieces';
export { combineMechanismEvidence } from './mechanism/combine-mechanism-evidence';
// The mechanism's vocabulary (its input, pieces, verdicts and their titles): all of that module.
export * from './mechanism/mechanism-evidence';
export {
  absorptionDifferences,
  type AbsorptionDifferenceInput,
  type AbsorptionDifferences,
  type QuencherAbsorbance,
} from './mechanism/absorption-differences';
export { fitBenesiHildebrand, type BenesiHildebrandFit } from './mechanism/fit-benesi-hildebrand';
export { fitBindingIsotherm, type BindingIsothermFit } from './mechanism/fit-binding-isotherm';
export {
  compareAssociationConstants,
  AGREEMENT_Z,
  type AssociationAgreement,
} from './mechanism/compare-association-constants';
export {
  analyseAbsorptionTitration,
  ABSORPTION_FAMILY_LEVEL,
  BENESI_HILDEBRAND_EXCESS,
  type AbsorptionBand,
  type AbsorptionBinding,
  type AbsorptionComparison,
  type AbsorptionFlag,
  type AbsorptionFlagCode,
  type AbsorptionTitrationAnalysis,
  type AbsorptionTitrationInput,
  type Attempt,
} from './mechanism/analyse-absorption-titration';

export * from './study-fit';
