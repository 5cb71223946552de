import type { Sequelize, Transaction } from 'sequelize';
import { pointValues, type StudyPointValues } from '@shared/schemas/study-points';
import type { LabContext } from '../../domain/lab-context';
import { OneStatement } from '../../db/one-statement';
import { AuditEvent, Study, StudyFit, StudyPoint } from '../../models';
import { unsavedAuditEvent } from '../audit.service';
import type { Actor, SignedInActor } from '../../domain/actor';
import { loadStudy, requireChangeable } from './study-access';
import { planRefit } from './study-fitting.service';
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
 * the audit log, bumps the version and refits, in two round trips: the old series read, then
 * everything written in one statement. Used by the grid and by a confirmed upload.
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
  const before = await StudyPoint.findAll({ where: { studyId: study.id }, order: [['position', 'ASC']], transaction });
  const sources = lifetimeSources(before, points);
  const written = points.map((point, position) =>
    StudyPoint.build({
      ...plain(point),
      ...sources[position]!,
      exclusionReason: point.excluded ? point.exclusionReason : null,
      studyId: study.id,
      position,
      uploadId: point.uploadId ?? null,
    }),
  );
  // The fit of the new series, with the version and both audit entries, decided before anything is written.
  const planned = await planRefit(study, {
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
  // Old points out, new points, the fit, the study's version and numbers, the audit entries: one
  // statement, one round trip (they were five, each waiting its turn in a busy event loop while
  // the transaction held the study's row: about 140 ms each under bench:load on a busy machine).
  const write = new OneStatement(transaction);
  write.sql(`DELETE FROM study_points WHERE study_id = ${write.param(study.id)}`);
  await write.insert(StudyPoint, written);
  if (planned.fit) await write.insert(StudyFit, [planned.fit]);
  await write.update(Study, study, planned.studyChanges);
  await write.insert(
    AuditEvent,
    planned.audits.map((entry) => unsavedAuditEvent(actor, entry)),
  );
  await write.run(StudyPoint.sequelize!);
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
