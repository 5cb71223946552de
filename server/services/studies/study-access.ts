import type { Transaction } from 'sequelize';
import { roleAtLeast } from '@shared/schemas/roles';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { Study } from '../../models';

/** 404 for a study id that is not in this lab. */
export const studyNotFound = () => new AppError('not_found', 'No study with this id in this lab.', 404);

/** The study in this lab (404 for another lab's id); locked FOR UPDATE inside a transaction. */
export async function loadStudy(lab: LabContext, studyId: string, transaction?: Transaction): Promise<Study> {
  const study = await Study.findOne({
    where: { id: studyId, labId: lab.id },
    ...(transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {}),
  });
  if (!study) throw studyNotFound();
  return study;
}

/** Researchers change their own studies only. */
export function requireOwner(study: Study, lab: LabContext, userId: string): void {
  if (study.ownerId !== userId) {
    throw new AppError('not_owner', 'Only the person who owns this study can change it.', 403);
  }
  if (!roleAtLeast(lab.role, 'researcher')) throw new AppError('forbidden', 'Your role cannot change studies.', 403);
}

/** The study a person is about to change: theirs, and open to change (else 403 or 409); locked inside a transaction. */
export async function loadStudyToChange(
  lab: LabContext,
  studyId: string,
  userId: string,
  transaction?: Transaction,
): Promise<Study> {
  const study = await loadStudy(lab, studyId, transaction);
  requireOwner(study, lab, userId);
  requireEditable(study);
  return study;
}

/** A study under review or approved does not change; approved ones change through a new revision. */
export function requireEditable(study: Study): void {
  if (study.status === 'approved') {
    throw new AppError(
      'study_locked',
      'This study is approved and locked. Start a new revision to change it; the approved one is kept.',
      409,
    );
  }
  if (study.status === 'submitted') {
    throw new AppError(
      'under_review',
      'This study is waiting for review and cannot change until a reviewer returns it.',
      409,
    );
  }
  if (!study.isCurrent)
    throw new AppError('superseded', 'A newer revision of this study exists; change that one.', 409);
}

/** Optimistic locking: the caller must have edited the version the database holds. */
export function requireVersion(study: Study, version: number): void {
  if (study.version !== version) {
    throw new AppError(
      'stale_version',
      `Someone changed this study since you opened it (you edited version ${version}, it is now at ${study.version}). Reload to see their changes, then apply yours again.`,
      409,
    );
  }
}

/** Owner check, lock check and version check for every change to a study or its series. */
export function requireChangeable(study: Study, lab: LabContext, userId: string, version: number): void {
  requireOwner(study, lab, userId);
  requireEditable(study);
  requireVersion(study, version);
}
