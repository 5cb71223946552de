import type { Sequelize } from 'sequelize';
import { roleAtLeast } from '@shared/schemas/roles';
import { AppError } from '../../lib/app-error';
import type { JobQueue } from '../../jobs/job-queue';
import type { LabContext } from '../../domain/lab-context';
import { Study, StudyPoint, StudyReview } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { SignedInActor } from '../../domain/actor';
import { loadStudy, requireOwner } from './study-access';
import { copyDecaySets } from '../decays/copy-decay-sets';
import { copySpectrumMatrices } from '../mechanism/copy-spectrum-matrices';
import { refitStudy } from './study-fitting.service';
import { notifyReview } from './study-mail';
import { getStudyDetail } from './study.service';

type Step = 'submit' | 'approve' | 'return';
const allowedFrom: Record<Step, string[]> = {
  submit: ['draft', 'returned'],
  approve: ['submitted'],
  return: ['submitted'],
};
const nextStatus = { submit: 'submitted', approve: 'approved', return: 'returned' } as const;

interface ReviewContext {
  actor: SignedInActor;
  jobs: JobQueue;
  publicUrl: string;
}

/** Owner submits; a reviewer (or admin) approves or returns with a comment. Each step mails the other side. */
export async function reviewStep(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  step: Step,
  comment: string,
  context: ReviewContext,
) {
  await sequelize.transaction(async (transaction) => {
    const found = await loadStudy(lab, studyId, transaction);
    if (step === 'submit') requireOwner(found, lab, context.actor.userId);
    else if (!roleAtLeast(lab.role, 'reviewer'))
      throw new AppError('forbidden', 'Only reviewers and admins approve or return studies.', 403);
    // A second pair of eyes (common practice in sign-off): nobody approves their own study.
    if (step === 'approve' && found.ownerId === context.actor.userId) {
      throw new AppError('own_study', 'You own this study, so another reviewer or admin has to approve it.', 403);
    }
    if (!found.isCurrent) throw new AppError('superseded', 'A newer revision of this study exists.', 409);
    if (!allowedFrom[step].includes(found.status)) {
      throw new AppError(
        'wrong_status',
        `A ${found.status} study cannot be ${step === 'submit' ? 'submitted' : step === 'approve' ? 'approved' : 'returned'}.`,
        409,
      );
    }
    if (step === 'submit' && !found.latestFitId) {
      throw new AppError('no_fit', 'The study has no fit yet; add points that can be fitted before submitting.', 409);
    }
    const before = found.status;
    await found.update({ status: nextStatus[step], version: found.version + 1 }, { transaction });
    await StudyReview.create({ studyId, authorId: context.actor.userId, action: step, comment }, { transaction });
    await recordLabAudit({ lab, actor: context.actor, transaction }, `study_${nextStatus[step]}`, ['study', studyId], {
      before: { status: before },
      after: { status: found.status },
      comment,
    });
    await notifyReview({ ...context, transaction }, found, step, context.actor.userId, comment);
  });
  return getStudyDetail(lab, studyId);
}

/** Any member who can write (researcher and up) may add to the comment thread. */
export async function addComment(lab: LabContext, studyId: string, comment: string, actor: SignedInActor) {
  const study = await loadStudy(lab, studyId);
  // The comment and its audit row are kept together or not at all.
  await StudyReview.sequelize!.transaction(async (transaction) => {
    await StudyReview.create(
      { studyId: study.id, authorId: actor.userId, action: 'comment', comment },
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'study_commented', ['study', study.id], { comment });
  });
  return getStudyDetail(lab, studyId);
}

/**
 * Changing an approved study: a new draft revision with the same settings and points, owned by
 * the person who starts it; the approved revision stays as it was, marked as superseded.
 */
export async function startRevision(sequelize: Sequelize, lab: LabContext, studyId: string, actor: SignedInActor) {
  const newId = await sequelize.transaction(async (transaction) => {
    const old = await loadStudy(lab, studyId, transaction);
    if (old.status !== 'approved')
      throw new AppError('not_approved', 'Only an approved study needs a new revision; edit this one directly.', 409);
    if (!old.isCurrent) throw new AppError('superseded', 'A newer revision of this study exists already.', 409);
    if (old.ownerId !== actor.userId && !roleAtLeast(lab.role, 'reviewer'))
      throw new AppError('not_owner', 'Only the owner or a reviewer can start a new revision.', 403);
    const {
      id: _id,
      status: _s,
      revision,
      version: _v,
      createdAt: _c,
      updatedAt: _u,
      latestFitId: _l,
      ...copy
    } = old.get({ plain: true });
    const fresh = await Study.create(
      {
        ...copy,
        ownerId: old.ownerId ?? actor.userId,
        revision: revision + 1,
        previousRevisionId: old.id,
        isCurrent: true,
      },
      { transaction },
    );
    await old.update({ isCurrent: false }, { transaction, silent: true });
    // The decay sets come along, and the copied links point at the copies.
    const decaySets = await copyDecaySets(old.id, fresh.id, transaction);
    const copiedSet = (setId: string | null | undefined) => (setId ? (decaySets.get(setId) ?? null) : null);
    if (old.tau0DecaySetId) await fresh.update({ tau0DecaySetId: copiedSet(old.tau0DecaySetId) }, { transaction });
    // So do the spectra behind the mechanism verdict (emission matrices and absorption titrations).
    const spectra = await copySpectrumMatrices(old.id, fresh.id, transaction);
    const points = await StudyPoint.findAll({ where: { studyId: old.id }, order: [['position', 'ASC']], transaction });
    await StudyPoint.bulkCreate(
      points.map((point) => {
        const { id: _p, ...values } = point.get({ plain: true });
        return { ...values, studyId: fresh.id, lifetimeDecaySetId: copiedSet(values.lifetimeDecaySetId) };
      }),
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'study_revision_started', ['study', fresh.id], {
      previousRevisionId: old.id,
      revision: fresh.revision,
      copied: {
        decaySets: decaySets.size,
        spectrumMatrices: spectra.emission,
        absorptionTitrations: spectra.absorption,
      },
    });
    await refitStudy(fresh, { trigger: 'auto', actor, transaction });
    return fresh.id;
  });
  return getStudyDetail(lab, newId);
}
