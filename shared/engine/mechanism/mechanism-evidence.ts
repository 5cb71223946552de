import type { TemperatureVerdict } from './analyse-temperature-series';
import type { SpectrumMatrixFlagCode } from './analyse-spectrum-matrix';

/*
 * The pieces of evidence on the quenching mechanism of one study, as readMechanismPieces and
 * combineMechanismEvidence take and give them. Constants in M⁻¹, rate constants in M⁻¹ s⁻¹,
 * energies in J/mol, temperatures in K.
 */

/** An estimate with its standard error and the degrees of freedom of the fit it came from. */
export interface EvidenceEstimate {
  value: number;
  standardError: number;
  degreesOfFreedom: number;
}

export interface LifetimeEvidence {
  /** K_SV from I0/I as a straight line; null when the study's fit is not a straight line */
  intensityKsv: EvidenceEstimate | null;
  /** K_SV from tau0/tau, with the same intercept treatment as the intensity line (like with like) */
  lifetimeKsv: EvidenceEstimate;
  intercept: 'free' | 'fixed-at-one';
  /** the combined static+dynamic fit I0/I = (1 + K_D[Q])(1 + K_S[Q]) where the study has one */
  combined: { kD: EvidenceEstimate; kS: EvidenceEstimate } | null;
}

export interface TemperatureEvidence {
  verdict: TemperatureVerdict;
  /** apparent activation energy of K_SV, > 0 when K_SV rises with T */
  kSvActivationEnergy: { value: number; standardError: number };
  /** the same for T/eta */
  diffusionActivationEnergy: number;
  /** the distinct temperatures of the series, K */
  temperatures: number[];
}

export interface WavelengthEvidence {
  flags: SpectrumMatrixFlagCode[];
  /** null when fewer than two bands have a K_SV */
  homogeneity: {
    weightedMean: number;
    weightedMeanStandardError: number;
    chiSquare: number;
    degreesOfFreedom: number;
    pValue: number;
    homogeneous: boolean;
  } | null;
  significantComponents: number;
  /** nm */
  bandWidth: number;
}

export interface AbsorptionEvidence {
  /** the absorption changes beyond the sum of emitter and quencher */
  changed: boolean;
  /** what was seen, in plain words */
  detail: string;
  /** association constant of a ground-state complex, M⁻¹, where it was fitted */
  associationConstant: { value: number; standardError: number } | null;
}

export interface DiffusionEvidence {
  kq: { value: number; standardError: number; interval95: { lower: number; upper: number } };
  /** k_diff = 8RT/3eta(T) at the study's temperature */
  diffusionLimit: number;
  temperature: number;
}

export type MechanismPieceKind = 'lifetime' | 'temperature' | 'wavelength' | 'absorption' | 'diffusion';

export interface MechanismEvidenceInput {
  lifetime: LifetimeEvidence | null;
  temperature: TemperatureEvidence | null;
  wavelength: WavelengthEvidence | null;
  absorption: AbsorptionEvidence | null;
  diffusion: DiffusionEvidence | null;
  /** why a piece is missing, when the caller knows better than "not measured" */
  missingBecause?: Partial<Record<MechanismPieceKind, string>>;
}

/**
 * What one piece says: a direction (dynamic, static, both), two emitters, "static-or-long-range"
 * (kq above the diffusion limit), "neutral" (consistent with either) or "unclear".
 */
export type PieceReading =
  'dynamic' | 'static' | 'both' | 'two-emitters' | 'static-or-long-range' | 'neutral' | 'unclear';

export interface PieceNumber {
  label: string;
  value: number;
  standardError: number | null;
  unit: string;
}

export interface MechanismPiece {
  kind: MechanismPieceKind;
  title: string;
  reading: PieceReading;
  /** what it says, in plain words with the numbers */
  summary: string;
  numbers: PieceNumber[];
}

export type MechanismVerdict = 'dynamic' | 'static' | 'both' | 'two-emitters' | 'unclear';

export interface MissingPiece {
  kind: MechanismPieceKind;
  title: string;
  /** what to add, or why the piece cannot be read */
  reason: string;
}

export interface MechanismAssessment {
  pieces: MechanismPiece[];
  verdict: MechanismVerdict;
  reasons: string[];
  missing: MissingPiece[];
}

export const PIECE_TITLES: Record<MechanismPieceKind, string> = {
  lifetime: 'Lifetime against intensity',
  temperature: 'Temperature trend',
  wavelength: 'Same K_SV at every wavelength',
  absorption: 'Absorption change',
  diffusion: 'kq against the diffusion limit',
};
