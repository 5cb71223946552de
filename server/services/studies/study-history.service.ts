import { Op } from 'sequelize';
import type { StudyHistory } from '@shared/schemas/study-detail';
import type { StudyFit as StudyFitRecord } from '@shared/schemas/study-fits';
import type { LabContext } from '../../domain/lab-context';
import { AuditEvent, StudyFit, User } from '../../models';
import { loadStudy } from './study-access';
import { toFit } from './study-serialize';

/** The audit trail of one study (every change with before and after), newest first. */
export async function studyHistory(lab: LabContext, studyId: string): Promise<StudyHistory> {
  await loadStudy(lab, studyId);
  const events = await AuditEvent.findAll({
    where: { labId: lab.id, targetType: 'study', targetId: studyId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: 500,
  });
  const actorIds = [...new Set(events.map((event) => event.actorId).filter((id): id is string => id !== null))];
  const names = new Map(
    (await User.findAll({ where: { id: { [Op.in]: actorIds } }, attributes: ['id', 'name'] })).map((user) => [
      user.id,
      user.name,
    ]),
  );
  return {
    events: events.map((event) => ({
      id: String(event.id),
      action: event.action,
      actor: event.actorId ? (names.get(event.actorId) ?? 'former member') : null,
      createdAt: event.createdAt.toISOString(),
      details: event.details,
    })),
  };
}

/** Every fit of the study, newest first (fits are never changed). */
export async function listFits(lab: LabContext, studyId: string): Promise<{ items: StudyFitRecord[] }> {
  await loadStudy(lab, studyId);
  const fits = await StudyFit.findAll({
    where: { studyId },
    include: [{ model: User, as: 'createdBy', attributes: ['name'] }],
    order: [['createdAt', 'DESC']],
    limit: 200,
  });
  return { items: fits.map(toFit) };
}
