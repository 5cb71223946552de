import type { Sequelize } from 'sequelize';
import type { FitModel, FitWeighting } from '@shared/schemas/studies';
import type { StudyFit as StudyFitRecord } from '@shared/schemas/study-fits';
import type { LabContext } from '../../domain/lab-context';
import { StudyFit, User } from '../../models';
import type { SignedInActor } from '../../domain/actor';
import { loadStudy, requireEditable, requireOwner } from './study-access';
import { refitStudy } from './study-fitting.service';
import { toFit } from './study-serialize';

/** A fit on demand with a chosen model and weighting; they become the study's, so the version moves on. */
export async function runFit(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  choice: { model: FitModel; weighting?: FitWeighting | undefined },
  actor: SignedInActor,
): Promise<StudyFitRecord> {
  const fitId = await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireOwner(study, lab, actor.userId);
    requireEditable(study);
    const fit = await refitStudy(study, {
      model: choice.model,
      ...(choice.weighting ? { weighting: choice.weighting } : {}),
      trigger: 'manual',
      actor,
      transaction,
    });
    await study.update({ version: study.version + 1 }, { transaction });
    return fit!.id;
  });
  const fit = await StudyFit.findByPk(fitId, { include: [{ model: User, as: 'createdBy', attributes: ['name'] }] });
  return toFit(fit!);
}
