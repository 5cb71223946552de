import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { pointValues, type StudyPointValues } from '@shared/schemas/study-points';
import type { LabContext } from '../../domain/lab-context';
import { StudyPoint, type Study } from '../../models';
import type { Actor, SignedInActor } from '../../domain/actor';
import { loadStudy, requireChangeable } from './study-access';
import { refitStudy } from './study-fitting.service';
import { getStudyDetail } from './study.service';

const plain = (point: StudyPoint | SeriesPoint) => pointValues(point);

/** A point as written: its values, the upload it came from, and where its lifetime came from. */
export type SeriesPoint = StudyPointValues & {
  uploadId?: string | null;
  lifetimeUncertainty?: number | null;
  lifetimeDecaySetId?: string | null;
};

/** A stored point as written again: its values, its upload and its lifetime's source unchanged. */
export const storedSeriesPoint = (point: StudyPoint): SeriesPoint => ({
  ...pointValues(point),
  uploadId: point.uploadId,
  lifetimeUncertainty: point.lifetimeUncertainty,
  lifetimeDecaySetId: point.lifetimeDecaySetId,
});

/**
 * A lifetime fitted from a decay keeps its standard error and source while the point keeps the
 * same concentration and the same lifetime (the grid sends values only); a changed value is the
 * person's own.
 */
function lifetimeSources(before: StudyPoint[], points: SeriesPoint[]) {
  const linked = before.filter((point) => point.lifetimeDecaySetId !== null && point.lifetime !== null);
  const taken = new Set<StudyPoint>();
  return points.map((point) => {
    if (point.lifetimeDecaySetId !== undefined)
      return { lifetimeUncertainty: point.lifetimeUncertainty ?? null, lifetimeDecaySetId: point.lifetimeDecaySetId };
    const same = linked.find(
      (old) => !taken.has(old) && old.concentration === point.concentration && old.lifetime === point.lifetime,
    );
    if (!same) return { lifetimeUncertainty: null, lifetimeDecaySetId: null };
    taken.add(same);
    return { lifetimeUncertainty: same.lifetimeUncertainty, lifetimeDecaySetId: same.lifetimeDecaySetId };
  });
}

/**
 * Replaces the whole series (the grid is edited as one table), records before and after in
 * the audit log, bumps the version and refits. Used by the grid and by a confirmed upload.
 */
export async function writeSeries(
  study: Study,
  points: SeriesPoint[],
  actor: Actor,
  transaction: Transaction,
  reason: {
    action: string;
    uploadId?: string;
    /** how the upload was read (for spectra: reduction and baseline), kept with the change */
    reading?: Record<string, unknown>;
    decaySetId?: string;
    tau0?: { value: number; standardError: number };
    /** an upload apply: a series that cannot be fitted is refused (nothing saved), not stored unfitted */
    refuseUnfittable?: boolean;
  },
): Promise<void> {
  // The old series comes back from its DELETE (no separate read), in position order.
  const removed = await StudyPoint.sequelize!.query('DELETE FROM study_points WHERE study_id = $1 RETURNING *', {
    bind: [study.id],
    type: QueryTypes.SELECT,
    model: StudyPoint,
    mapToModel: true,
    transaction,
  });
  const before = [...removed].sort((a, b) => a.position - b.position);
  const sources = lifetimeSources(before, points);
  const written = await StudyPoint.bulkCreate(
    points.map((point, position) => ({
      ...plain(point),
      ...sources[position]!,
      exclusionReason: point.excluded ? point.exclusionReason : null,
      studyId: study.id,
      position,
      uploadId: point.uploadId ?? null,
    })),
    { transaction },
  );
  // The version, the fit's numbers and both audit entries go in the refit's own statements.
  await refitStudy(study, {
    trigger: 'auto',
    actor,
    transaction,
    refuseUnfittable: reason.refuseUnfittable ?? false,
    points: written,
    studyChanges: { version: study.version + 1 },
    audits: [
      {
        action: reason.action,
        labId: study.labId,
        targetType: 'study',
        targetId: study.id,
        details: {
          before: before.map(plain),
          after: points.map(plain),
          ...(reason.uploadId ? { uploadId: reason.uploadId } : {}),
          ...reason.reading,
          ...(reason.decaySetId ? { decaySetId: reason.decaySetId } : {}),
          ...(reason.tau0 ? { tau0: reason.tau0 } : {}),
        },
      },
    ],
  });
}

export async function replacePoints(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  input: { version: number; points: StudyPointValues[] },
  actor: SignedInActor,
) {
  await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    await writeSeries(study, input.points, actor, transaction, { action: 'study_points_replaced' });
  });
  return getStudyDetail(lab, studyId);
}
