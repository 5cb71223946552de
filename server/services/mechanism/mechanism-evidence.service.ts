import {
  combineMechanismEvidence,
  type DiffusionEvidence,
  type LifetimeEvidence,
  type MechanismPieceKind,
  type TemperatureEvidence,
  type WavelengthEvidence,
} from '@shared/engine';
import type { MechanismEvidence, MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { Study } from '../../models';
import { studyNotFound } from '../studies/study-access';
import { absorptionEvidenceOf } from './absorption-titrations.service';
import {
  evidenceStudyRows,
  newestMatrixRows,
  SERIES_LIMIT,
  type EvidenceStudyRow,
  type NewestMatrixRow,
} from './mechanism-evidence-rows';
import type { PendingSpectra } from './pending-spectra';
import { analyseSeriesMembers } from './temperature-series.service';

type Missing = Partial<Record<MechanismPieceKind, string>>;

/** The lifetime line beside the intensity line (or the combined fit) of the study's newest fit. */
function lifetimeOf(study: EvidenceStudyRow): LifetimeEvidence | null {
  const { lifetime, parameters, fitModel } = study;
  if (!lifetime || !parameters) return null;
  const intercept = lifetime.intercept ?? 'free';
  const line = parameters.kSv;
  const df = study.degreesOfFreedom ?? 0;
  // A lifetimes-only fit is the lifetime line itself: there is no intensity line to set beside it.
  const isLine =
    (fitModel === 'linear-free' || fitModel === 'linear-fixed') && study.intensityFit !== 'no-intensity-data';
  const { kD, kS } = parameters;
  return {
    intensityKsv:
      isLine && line ? { value: line.value, standardError: line.standardError, degreesOfFreedom: df } : null,
    lifetimeKsv: {
      value: lifetime.kSv.value,
      standardError: lifetime.kSv.standardError,
      degreesOfFreedom: lifetime.pointCount - (intercept === 'free' ? 2 : 1),
    },
    intercept,
    combined:
      kD && kS
        ? {
            kD: { value: kD.value, standardError: kD.standardError, degreesOfFreedom: df },
            kS: { value: kS.value, standardError: kS.standardError, degreesOfFreedom: df },
          }
        : null,
  };
}

/** kq of the newest fit against k_diff = 8RT/3eta(T) at the study's own temperature (study-fit kinetics). */
function diffusionOf(study: EvidenceStudyRow, missing: Missing): DiffusionEvidence | null {
  const kq = study.parameters?.kq;
  const limit = study.diffusionLimit;
  if (!kq) {
    missing.diffusion = 'Give τ0 (entered, from a lifetime record or from lifetime blanks) to turn K_SV into kq.';
    return null;
  }
  if (!limit) {
    missing.diffusion = 'Choose a solvent from the table, or enter the viscosity, for the diffusion limit.';
    return null;
  }
  return {
    kq: { value: kq.value, standardError: kq.standardError, interval95: kq.interval95 },
    diffusionLimit: limit.value,
    temperature: study.temperature,
  };
}

const pairKey = (study: EvidenceStudyRow) =>
  JSON.stringify([study.emitterId, study.quencherId, study.solventId, study.customSolventName]);

type SeriesAnswer = { evidence: TemperatureEvidence } | { problem: string };

/** The series of any current study of a pair: the same for each (kept per pair, not filtered again per study). */
const currentSiblings = new WeakMap<EvidenceStudyRow[], EvidenceStudyRow[]>();
function currentSiblingsOf(pairMembers: EvidenceStudyRow[]): EvidenceStudyRow[] {
  let siblings = currentSiblings.get(pairMembers);
  if (!siblings)
    currentSiblings.set(pairMembers, (siblings = pairMembers.filter((s) => s.isCurrent).slice(0, SERIES_LIMIT)));
  return siblings;
}

/**
 * The temperature series the study belongs to: the lab's current studies of the same pair in the
 * same solvent (the study itself included, current or not; at most 40, coolest first) with a
 * fitted K_SV, analysed once it spans 3 temperatures. `analysed` keeps each set's analysis, as
 * the studies of one series share it.
 */
function temperatureOf(
  study: EvidenceStudyRow,
  pairMembers: EvidenceStudyRow[],
  analysed: Map<string, SeriesAnswer>,
  missing: Missing,
): { evidence: TemperatureEvidence | null; series: MechanismEvidence['series'] } {
  const siblings = study.isCurrent
    ? currentSiblingsOf(pairMembers)
    : pairMembers.filter((s) => s.isCurrent || s.id === study.id).slice(0, SERIES_LIMIT);
  const fitted = siblings.filter((s) => s.kSv !== null && s.kSv > 0);
  const temperatures = [...new Set(siblings.map((s) => s.temperature))];
  const series = temperatures.length >= 2 ? { studyIds: siblings.map((s) => s.id), temperatures } : null;
  const fittedTemperatures = new Set(fitted.map((s) => s.temperature)).size;
  if (fittedTemperatures < 3) {
    missing.temperature = `The same pair in the same solvent has a fitted K_SV at ${fittedTemperatures} temperature${fittedTemperatures === 1 ? '' : 's'}; a trend needs 3 or more.`;
    return { evidence: null, series };
  }
  const key = fitted.map((s) => s.id).join(',');
  if (!analysed.has(key)) analysed.set(key, analyseSeriesOf(fitted));
  const answer = analysed.get(key)!;
  if ('problem' in answer) {
    missing.temperature = `The temperature series cannot be read: ${answer.problem}`;
    return { evidence: null, series };
  }
  return { evidence: answer.evidence, series };
}

function analyseSeriesOf(fitted: EvidenceStudyRow[]): SeriesAnswer {
  try {
    const analysis = analyseSeriesMembers(fitted);
    return {
      evidence: {
        verdict: analysis.verdict,
        kSvActivationEnergy: analysis.kSvActivationEnergy,
        diffusionActivationEnergy: analysis.diffusionActivationEnergy,
        temperatures: [...new Set(analysis.points.map((p) => p.temperature))],
      },
    };
  } catch (error) {
    if (!(error instanceof AppError) || error.status !== 400) throw error;
    return { problem: error.message };
  }
}

/** The K_SV homogeneity, components and flags of the study's newest spectrum matrix. */
function wavelengthOf(matrix: Extract<NewestMatrixRow, { kind: 'emission' }> | undefined): WavelengthEvidence | null {
  if (!matrix) return null;
  const { analysis } = matrix;
  return {
    flags: analysis.flags.map((flag) => flag.code),
    homogeneity: analysis.homogeneity,
    significantComponents: analysis.components.significant,
    bandWidth: analysis.bandWidth,
  };
}

type EmissionRow = Extract<NewestMatrixRow, { kind: 'emission' }>;
type AbsorptionRow = Extract<NewestMatrixRow, { kind: 'absorption' }>;

/** The newest matrix as it will be once a pending re-analysis of it is written. */
function withPendingMatrix(row: EmissionRow, pending: PendingSpectra): EmissionRow {
  const change = pending.spectrumMatrix;
  return change?.analysis && change.id === row.id ? { ...row, analysis: change.analysis } : row;
}

/** The newest titration as it will be once a pending re-analysis of it is written. */
function withPendingTitration(row: AbsorptionRow, pending: PendingSpectra): AbsorptionRow {
  const change = pending.absorptionTitration?.change;
  return change && pending.absorptionTitration!.id === row.id
    ? { ...row, analysis: change.analysis, associationFit: change.settings.associationFit }
    : row;
}

/**
 * The mechanism evidence of each study asked for (engine combineMechanismEvidence): what each
 * piece that exists says, the combined verdict with reasons, the missing pieces with what to add.
 * Reads only, in two statements whatever the number of studies: the studies with their series
 * and newest fits, then their newest spectrum matrices and absorption titrations. Studies not in
 * the lab are left out of the answer. With `pending`, a change to the spectra not yet written is
 * read as if it were (verdictChange).
 */
export async function mechanismEvidenceOfStudies(
  lab: LabContext,
  studyIds: string[],
  pending: PendingSpectra = {},
): Promise<Map<string, MechanismEvidence>> {
  const answers = new Map<string, MechanismEvidence>();
  if (studyIds.length === 0) return answers;
  const sequelize = Study.sequelize!;
  // A discard about to be written: the study's newest record is then the one before it.
  const { spectrumMatrix: matrixChange, absorptionTitration: titrationChange } = pending;
  const leaveOut = [
    ...(matrixChange && !matrixChange.analysis ? [matrixChange.id] : []),
    ...(titrationChange && !titrationChange.change ? [titrationChange.id] : []),
  ];
  const [rows, matrices] = await Promise.all([
    evidenceStudyRows(sequelize, lab.id, studyIds),
    newestMatrixRows(sequelize, lab.id, studyIds, leaveOut),
  ]);
  const byPair = new Map<string, EvidenceStudyRow[]>();
  for (const row of rows) {
    const key = pairKey(row);
    const members = byPair.get(key);
    if (members) members.push(row);
    else byPair.set(key, [row]);
  }
  const emission = new Map<string, Extract<NewestMatrixRow, { kind: 'emission' }>>();
  const absorption = new Map<string, Extract<NewestMatrixRow, { kind: 'absorption' }>>();
  for (const matrix of matrices) {
    if (matrix.kind === 'emission') emission.set(matrix.studyId, withPendingMatrix(matrix, pending));
    else absorption.set(matrix.studyId, withPendingTitration(matrix, pending));
  }
  const analysed = new Map<string, SeriesAnswer>();
  const wanted = new Set(studyIds);
  for (const study of rows) {
    if (!wanted.has(study.id)) continue;
    const missing: Missing = {};
    if (!study.fitModel)
      missing.lifetime = 'Fit the study first; then add lifetimes at each [Q] to compare τ0/τ with I0/I.';
    const temperature = temperatureOf(study, byPair.get(pairKey(study))!, analysed, missing);
    const matrix = emission.get(study.id);
    const titration = absorption.get(study.id);
    const assessment = combineMechanismEvidence({
      lifetime: lifetimeOf(study),
      temperature: temperature.evidence,
      wavelength: wavelengthOf(matrix),
      absorption: titration ? absorptionEvidenceOf(titration.analysis, titration.associationFit ?? 'isotherm') : null,
      diffusion: diffusionOf(study, missing),
      missingBecause: missing,
    });
    answers.set(study.id, {
      studyId: study.id,
      ...assessment,
      series: temperature.series,
      spectrumMatrixId: matrix?.id ?? null,
    });
  }
  return answers;
}

/** The mechanism evidence of one study (mechanismEvidenceOfStudies); 404 when it is not in the lab. */
export async function mechanismEvidence(
  lab: LabContext,
  studyId: string,
  pending: PendingSpectra = {},
): Promise<MechanismEvidence> {
  const evidence = (await mechanismEvidenceOfStudies(lab, [studyId], pending)).get(studyId);
  if (!evidence) throw studyNotFound();
  return evidence;
}

/**
 * The study's verdict now and after a pending change to its spectra, worked out before the change
 * is written so both go into its audit entry (the change is never silent).
 */
export async function verdictChange(
  lab: LabContext,
  studyId: string,
  pending: PendingSpectra,
): Promise<MechanismVerdictChange> {
  const [before, after] = await Promise.all([
    mechanismEvidence(lab, studyId),
    mechanismEvidence(lab, studyId, pending),
  ]);
  return { before: before.verdict, after: after.verdict, reasons: after.reasons };
}
