import type { Sequelize } from 'sequelize';
import type { CreateStudyInput, UpdateStudyInput } from '@shared/schemas/studies';
import { studySettingsIssues } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { DecayFile, DecaySet, Study, StudyFit, StudyPoint, StudyReview, StudyUpload, User } from '../../models';
import { recordAudit } from '../audit.service';
import type { SignedInActor } from '../../domain/actor';
import { loadStudy, loadStudyWithNames, requireChangeable } from './study-access';
import { resolveCompound } from './study-compounds';
import { refitStudy } from './study-fitting.service';
import { resolveTau0 } from './study-tau0';
import {
  isLegacyResult,
  settingsOf,
  solventLabel,
  toFit,
  toPoint,
  toReview,
  toTau0Source,
  toUpload,
} from './study-serialize';

const settingsIssuesError = (issues: { path: string; message: string }[]) =>
  new AppError(
    'validation_failed',
    `The study has problems: ${issues.map((issue) => `${issue.path}: ${issue.message}`).join('; ')}`,
    400,
    issues.map((issue) => ({ path: `body.${issue.path}`, message: issue.message })),
  );

export async function createStudy(
  sequelize: Sequelize,
  lab: LabContext,
  input: CreateStudyInput,
  actor: SignedInActor,
) {
  const studyId = await sequelize.transaction(async (transaction) => {
    const emitter = await resolveCompound(
      lab,
      { id: input.emitterId, newName: input.newEmitterName },
      'photocatalyst',
      'emitterId',
      actor,
      transaction,
    );
    const quencher = await resolveCompound(
      lab,
      { id: input.quencherId, newName: input.newQuencherName },
      'quencher',
      'quencherId',
      actor,
      transaction,
    );
    const { emitterId: _e, quencherId: _q, newEmitterName: _ne, newQuencherName: _nq, ...settings } = input;
    const tau0 = await resolveTau0(lab, settings, null, emitter.id, transaction);
    const study = await Study.create(
      {
        ...settings,
        ...tau0,
        labId: lab.id,
        emitterId: emitter.id,
        quencherId: quencher.id,
        ownerId: actor.userId,
        previousRevisionId: null,
      },
      { transaction },
    );
    await recordAudit(
      actor,
      {
        action: 'study_created',
        labId: lab.id,
        targetType: 'study',
        targetId: study.id,
        details: { after: settingsOf(study) },
      },
      transaction,
    );
    return study.id;
  });
  return getStudyDetail(lab, studyId);
}

export async function updateStudy(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  input: UpdateStudyInput,
  actor: SignedInActor,
) {
  await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    const before = { ...settingsOf(study), emitterId: study.emitterId, quencherId: study.quencherId };
    const { version: _v, emitterId, quencherId, newEmitterName, newQuencherName, ...changes } = input;
    const defined = Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined));
    const merged = { ...settingsOf(study), ...defined };
    const issues = studySettingsIssues(merged);
    if (issues.length) throw settingsIssuesError(issues);
    const compounds: { emitterId?: string; quencherId?: string } = {};
    if (emitterId || newEmitterName)
      compounds.emitterId = (
        await resolveCompound(
          lab,
          { id: emitterId, newName: newEmitterName },
          'photocatalyst',
          'emitterId',
          actor,
          transaction,
        )
      ).id;
    if (quencherId || newQuencherName)
      compounds.quencherId = (
        await resolveCompound(
          lab,
          { id: quencherId, newName: newQuencherName },
          'quencher',
          'quencherId',
          actor,
          transaction,
        )
      ).id;
    const tau0 = await resolveTau0(
      lab,
      { tau0: changes.tau0, tau0Uncertainty: changes.tau0Uncertainty, tau0LifetimeId: changes.tau0LifetimeId },
      study,
      compounds.emitterId ?? study.emitterId,
      transaction,
    );
    // tau0 stays "from decay" only while it is the number the decays gave.
    const tau0DecaySetId =
      tau0.tau0LifetimeId === null && tau0.tau0 === study.tau0 && tau0.tau0Uncertainty === study.tau0Uncertainty
        ? study.tau0DecaySetId
        : null;
    await study.update(
      { ...defined, ...compounds, ...tau0, tau0DecaySetId, version: study.version + 1 },
      { transaction },
    );
    await recordAudit(
      actor,
      {
        action: 'study_updated',
        labId: lab.id,
        targetType: 'study',
        targetId: study.id,
        details: { before, after: { ...settingsOf(study), emitterId: study.emitterId, quencherId: study.quencherId } },
      },
      transaction,
    );
    await refitStudy(study, { trigger: 'auto', actor, transaction });
  });
  return getStudyDetail(lab, studyId);
}

/**
 * A latest fit stored before the plot series carried their axes and left-out points is fitted
 * again once, on first read, with the same model (a new fit record; the old one is kept). When it
 * cannot be fitted now, nothing changes and the old record is shown as it was.
 */
async function refitLegacyFit(lab: LabContext, studyId: string): Promise<boolean> {
  try {
    return await Study.sequelize!.transaction(async (transaction) => {
      const study = await Study.findOne({
        where: { id: studyId, labId: lab.id },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      const fit = study?.latestFitId
        ? await StudyFit.findByPk(study.latestFitId, { attributes: ['id', 'model', 'result'], transaction })
        : null;
      if (!study || !fit || !isLegacyResult(fit.result)) return false;
      const actor = { userId: null, ip: null };
      await refitStudy(study, { model: fit.model, trigger: 'auto', actor, transaction, refuseUnfittable: true });
      return true;
    });
  } catch (error) {
    if (error instanceof AppError) return false;
    throw error;
  }
}

export async function getStudyDetail(lab: LabContext, studyId: string, refitted = false): Promise<StudyDetail> {
  const study = await loadStudyWithNames(lab, studyId);
  // Plain rows (raw, nested includes): the answer is built from their fields, so Sequelize need not
  // make model instances of every point, upload and review (its largest cost per read).
  const [points, latestFit, uploads, reviews, next, decaySets] = await Promise.all([
    StudyPoint.findAll({ where: { studyId }, order: [['position', 'ASC']], raw: true }),
    study.latestFitId
      ? StudyFit.findOne({
          where: { id: study.latestFitId },
          include: [{ model: User, as: 'createdBy', attributes: ['name'] }],
          raw: true,
          nest: true,
        })
      : null,
    StudyUpload.findAll({
      where: { studyId },
      attributes: { exclude: ['content'] },
      include: [{ model: User, as: 'uploadedBy', attributes: ['name'] }],
      order: [['createdAt', 'DESC']],
      raw: true,
      nest: true,
    }),
    StudyReview.findAll({
      where: { studyId },
      include: [{ model: User, as: 'author', attributes: ['name'] }],
      order: [['createdAt', 'ASC']],
      raw: true,
      nest: true,
    }),
    Study.findOne({ where: { previousRevisionId: studyId, labId: lab.id }, attributes: ['id'], raw: true }),
    DecaySet.findAll({
      where: { studyId, labId: lab.id },
      attributes: ['id'],
      include: [{ model: DecayFile, as: 'file', attributes: ['fileName'] }],
    }),
  ]);
  if (!refitted && latestFit && isLegacyResult(latestFit.result) && (await refitLegacyFit(lab, studyId)))
    return getStudyDetail(lab, studyId, true);
  const sources = new Map(decaySets.map((set) => [set.id, set.file?.fileName ?? 'decay file']));
  return {
    ...settingsOf(study),
    id: study.id,
    emitter: { id: study.emitterId, name: study.emitter?.name ?? '' },
    quencher: { id: study.quencherId, name: study.quencher?.name ?? '' },
    solventLabel: solventLabel(study),
    status: study.status,
    revision: study.revision,
    previousRevisionId: study.previousRevisionId,
    nextRevisionId: next?.id ?? null,
    ownerId: study.ownerId,
    ownerName: study.owner?.name ?? 'former member',
    version: study.version,
    createdAt: study.createdAt.toISOString(),
    updatedAt: study.updatedAt.toISOString(),
    points: points.map((point) => toPoint(study, point, sources)),
    latestFit: latestFit ? toFit(latestFit) : null,
    fitProblem: study.fitProblem,
    tau0Source: toTau0Source(study, sources),
    uploads: uploads.map(toUpload),
    reviews: reviews.map(toReview),
  };
}
