import { Op } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { Dashboard, DashboardStudy } from '@shared/schemas/dashboard';
import { roleAtLeast } from '@shared/schemas/roles';
import type { LabContext } from '../../domain/lab-context';
import { AuditEvent, Compound, ReactionScenario, Study, User } from '../../models';
import { describeActivity } from './describe-activity';

async function studies(where: WhereOptions<Study>, limit = 10): Promise<DashboardStudy[]> {
  const rows = await Study.findAll({
    where: { ...where, isCurrent: true } as WhereOptions<Study>,
    include: [
      { model: Compound, as: 'emitter', attributes: ['name'] },
      { model: Compound, as: 'quencher', attributes: ['name'] },
      { model: User, as: 'owner', attributes: ['name'] },
    ],
    order: [['updatedAt', 'DESC']],
    limit,
  });
  return rows.map((study) => ({
    id: study.id,
    title: study.title,
    emitter: study.emitter?.name ?? '',
    quencher: study.quencher?.name ?? '',
    owner: study.owner?.name ?? null,
    status: study.status,
    kq: study.kq,
    flagged: study.flagged,
    updatedAt: study.updatedAt.toISOString(),
  }));
}

/** Titles of the studies, compounds and scenarios the events point at, to name them in the activity list. */
async function targetNames(events: AuditEvent[]): Promise<Map<string, string>> {
  const idsOf = (type: string) => [
    ...new Set(events.filter((e) => e.targetType === type && e.targetId).map((e) => e.targetId!)),
  ];
  const names = new Map<string, string>();
  for (const study of await Study.findAll({ where: { id: idsOf('study') }, attributes: ['id', 'title'] }))
    names.set(`study:${study.id}`, study.title);
  for (const compound of await Compound.findAll({ where: { id: idsOf('compound') }, attributes: ['id', 'name'] }))
    names.set(`compound:${compound.id}`, compound.name);
  for (const scenario of await ReactionScenario.findAll({
    where: { id: idsOf('scenario') },
    attributes: ['id', 'name'],
  }))
    names.set(`scenario:${scenario.id}`, scenario.name);
  return names;
}

/** The landing screen of a lab: what waits for me, what came back to me, what looks wrong, what happened. */
export async function getDashboard(lab: LabContext, userId: string): Promise<Dashboard> {
  // Sign-ins are not lab news, and the automatic refit after each edit would drown the rest.
  const events = await AuditEvent.findAll({
    where: {
      labId: lab.id,
      action: { [Op.notIn]: ['sign_in', 'sign_in_failed', 'sign_out'] },
      [Op.not]: { action: 'study_fitted', details: { trigger: 'auto' } },
    } as WhereOptions<AuditEvent>,
    order: [['id', 'DESC']],
    limit: 20,
  });
  const names = await targetNames(events);
  const actorIds = [...new Set(events.map((event) => event.actorId).filter((id): id is string => id !== null))];
  const actors = new Map(
    (await User.findAll({ where: { id: actorIds }, attributes: ['id', 'name'] })).map((user) => [user.id, user.name]),
  );
  return {
    waitingForMyReview: roleAtLeast(lab.role, 'reviewer') ? await studies({ labId: lab.id, status: 'submitted' }) : [],
    myReturned: await studies({ labId: lab.id, status: 'returned', ownerId: userId }),
    myDrafts: await studies({ labId: lab.id, status: 'draft', ownerId: userId }, 6),
    recentlyFlagged: await studies({ labId: lab.id, flagged: true }, 8),
    recentActivity: events.map((event) => ({
      id: Number(event.id),
      action: event.action,
      description: describeActivity(event, names.get(`${event.targetType}:${event.targetId}`)),
      actor: event.actorId ? (actors.get(event.actorId) ?? null) : null,
      targetType: event.targetType,
      targetId: event.targetId,
      at: event.createdAt.toISOString(),
    })),
  };
}
