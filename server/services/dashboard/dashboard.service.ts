import { Op } from 'sequelize';
import type { WhereOptions } from 'sequelize';
import type { Dashboard, DashboardStudy } from '@shared/schemas/dashboard';
import { roleAtLeast } from '@shared/schemas/roles';
import type { LabContext } from '../../domain/lab-context';
import { AuditEvent, Compound, ReactionScenario, Study, User } from '../../models';
import { describeActivity } from './describe-activity';

async function studies(where: WhereOptions<Study>, limit = 10): Promise<DashboardStudy[]> {
  const rows = (await Study.findAll({
    where: { ...where, isCurrent: true } as WhereOptions<Study>,
    attributes: ['id', 'title', 'status', 'kq', 'flagged', 'updatedAt'],
    include: [
      { model: Compound, as: 'emitter', attributes: ['name'] },
      { model: Compound, as: 'quencher', attributes: ['name'] },
      { model: User, as: 'owner', attributes: ['name'] },
    ],
    order: [['updatedAt', 'DESC']],
    limit,
    raw: true,
    nest: true,
  })) as unknown as Array<
    Pick<Study, 'id' | 'title' | 'status' | 'kq' | 'flagged' | 'updatedAt'> & {
      emitter: { name: string | null };
      quencher: { name: string | null };
      owner: { name: string | null };
    }
  >;
  return rows.map((study) => ({
    id: study.id,
    title: study.title,
    emitter: study.emitter.name ?? '',
    quencher: study.quencher.name ?? '',
    owner: study.owner.name ?? null,
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
  const [studyRows, compoundRows, scenarioRows] = await Promise.all([
    Study.findAll({ where: { id: idsOf('study') }, attributes: ['id', 'title'], raw: true }),
    Compound.findAll({ where: { id: idsOf('compound') }, attributes: ['id', 'name'], raw: true }),
    ReactionScenario.findAll({ where: { id: idsOf('scenario') }, attributes: ['id', 'name'], raw: true }),
  ]);
  return new Map([
    ...studyRows.map((study) => [`study:${study.id}`, study.title] as const),
    ...compoundRows.map((compound) => [`compound:${compound.id}`, compound.name] as const),
    ...scenarioRows.map((scenario) => [`scenario:${scenario.id}`, scenario.name] as const),
  ]);
}

/** The landing screen of a lab: what waits for me, what came back to me, what looks wrong, what happened. */
export async function getDashboard(lab: LabContext, userId: string): Promise<Dashboard> {
  // The lists do not depend on each other: asked together, the screen waits for the slowest only.
  const [events, waitingForMyReview, myReturned, myDrafts, recentlyFlagged] = await Promise.all([
    // Sign-ins are not lab news, and the automatic refit after each edit would drown the rest.
    AuditEvent.findAll({
      where: {
        labId: lab.id,
        action: { [Op.notIn]: ['sign_in', 'sign_in_failed', 'sign_out'] },
        [Op.not]: { action: 'study_fitted', details: { trigger: 'auto' } },
      } as WhereOptions<AuditEvent>,
      order: [['id', 'DESC']],
      limit: 20,
    }),
    roleAtLeast(lab.role, 'reviewer') ? studies({ labId: lab.id, status: 'submitted' }) : [],
    studies({ labId: lab.id, status: 'returned', ownerId: userId }),
    studies({ labId: lab.id, status: 'draft', ownerId: userId }, 6),
    studies({ labId: lab.id, flagged: true }, 8),
  ]);
  const actorIds = [...new Set(events.map((event) => event.actorId).filter((id): id is string => id !== null))];
  const [names, actorRows] = await Promise.all([
    targetNames(events),
    User.findAll({ where: { id: actorIds }, attributes: ['id', 'name'], raw: true }),
  ]);
  const actors = new Map(actorRows.map((user) => [user.id, user.name]));
  return {
    waitingForMyReview,
    myReturned,
    myDrafts,
    recentlyFlagged,
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
