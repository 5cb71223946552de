import type { Dashboard, DashboardStudy } from '@shared/schemas/dashboard';
import { roleAtLeast } from '@shared/schemas/roles';
import { fixedStatement, selectRows } from '../../db/select-rows';
import type { LabContext } from '../../domain/lab-context';
import { Study } from '../../models';
import { describeActivity } from './describe-activity';

type ListName = 'waitingForMyReview' | 'myReturned' | 'myDrafts' | 'recentlyFlagged';
type ListRow = {
  list: ListName;
  id: string;
  title: string;
  status: DashboardStudy['status'];
  kq: number | null;
  flagged: boolean;
  updated_at: Date;
  emitter: string | null;
  quencher: string | null;
  owner: string | null;
};
type EventRow = {
  id: number;
  action: string;
  actor_id: string | null;
  target_type: string | null;
  target_id: string | null;
  created_at: Date;
  actor: string | null;
  target_name: string | null;
};

/**
 * One list of the lab's current studies, newest change first. Each list reads one stretch of an
 * index that starts with its filter (lab_id, then status and owner, or flagged: migrations 0005
 * and 20261203-0840) and stops after its LIMIT, so its plan is the same for a small or a large lab.
 */
const listPart = (list: ListName, condition: string, limit: number) => `(
  SELECT '${list}' AS list, s.id, s.title, s.status, s.kq, s.flagged, s.updated_at,
         s.emitter_id, s.quencher_id, s.owner_id
  FROM studies s
  WHERE s.lab_id = $1 AND s.is_current AND ${condition}
  ORDER BY s.updated_at DESC
  LIMIT ${limit})`;

/**
 * The lists in one UNION ALL (one round trip), with the names joined once over its few rows: a
 * join inside each part made PostgreSQL plan sixteen tables, longer than running them (about 2.5
 * against 0.4 ms, EXPLAIN ANALYZE on the load benchmark's 5,000 studies). The text depends only on
 * whether the reader reviews, so it runs as one of two prepared statements (fixedStatement).
 */
const listsSql = (reviewer: boolean) =>
  fixedStatement(`
  SELECT p.list, p.id, p.title, p.status, p.kq, p.flagged, p.updated_at,
         e.name AS emitter, q.name AS quencher, o.name AS owner
  FROM (${[
    ...(reviewer ? [listPart('waitingForMyReview', "s.status = 'submitted'", 10)] : []),
    listPart('myReturned', "s.status = 'returned' AND s.owner_id = $2", 10),
    listPart('myDrafts', "s.status = 'draft' AND s.owner_id = $2", 6),
    listPart('recentlyFlagged', 's.flagged', 8),
  ].join('\nUNION ALL\n')}) p
  LEFT JOIN compounds e ON e.id = p.emitter_id
  LEFT JOIN compounds q ON q.id = p.quencher_id
  LEFT JOIN users o ON o.id = p.owner_id`);
const reviewerListsSql = listsSql(true);
const memberListsSql = listsSql(false);

/**
 * The lab's last 20 events with who did them and the title of what they touched. Sign-ins are not
 * lab news, and the automatic refit after each edit would drown the rest. The lab's events are
 * read newest first through (lab_id, id) (migration 20261203-0840), as a prepared statement.
 */
const eventsSql = fixedStatement(`
  SELECT ev.id, ev.action, ev.actor_id, ev.target_type, ev.target_id, ev.created_at,
         u.name AS actor, COALESCE(s.title, c.name, r.name) AS target_name
  FROM (
    SELECT id, action, actor_id, target_type, target_id, created_at
    FROM audit_events
    WHERE lab_id = $1
      AND action NOT IN ('sign_in', 'sign_in_failed', 'sign_out')
      AND NOT (action = 'study_fitted' AND (details #>> '{trigger}') = 'auto')
    ORDER BY id DESC
    LIMIT 20
  ) ev
  LEFT JOIN users u ON u.id = ev.actor_id
  LEFT JOIN studies s ON s.id = (CASE WHEN ev.target_type = 'study' THEN ev.target_id END)::uuid
  LEFT JOIN compounds c ON c.id = (CASE WHEN ev.target_type = 'compound' THEN ev.target_id END)::uuid
  LEFT JOIN reaction_scenarios r ON r.id = (CASE WHEN ev.target_type = 'scenario' THEN ev.target_id END)::uuid
  ORDER BY ev.id DESC`);

/** The landing screen of a lab: what waits for me, what came back to me, what looks wrong, what happened. */
export async function getDashboard(lab: LabContext, userId: string): Promise<Dashboard> {
  const sequelize = Study.sequelize!;
  // Two round trips, asked together: the screen waits for the slower one only.
  const [listRows, events] = await Promise.all([
    selectRows<ListRow>(sequelize, roleAtLeast(lab.role, 'reviewer') ? reviewerListsSql : memberListsSql, [
      lab.id,
      userId,
    ]),
    selectRows<EventRow>(sequelize, eventsSql, [lab.id]),
  ]);
  const lists: Record<ListName, DashboardStudy[]> = {
    waitingForMyReview: [],
    myReturned: [],
    myDrafts: [],
    recentlyFlagged: [],
  };
  for (const row of listRows) {
    lists[row.list].push({
      id: row.id,
      title: row.title,
      emitter: row.emitter ?? '',
      quencher: row.quencher ?? '',
      owner: row.owner ?? null,
      status: row.status,
      kq: row.kq,
      flagged: row.flagged,
      updatedAt: row.updated_at.toISOString(),
    });
  }
  // UNION ALL keeps no order across its parts: newest change first within each list again.
  for (const list of Object.values(lists)) list.sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
  return {
    ...lists,
    recentActivity: events.map((event) => ({
      id: Number(event.id),
      action: event.action,
      description: describeActivity(event, event.target_name ?? undefined),
      actor: event.actor_id ? event.actor : null,
      targetType: event.target_type,
      targetId: event.target_id,
      at: event.created_at.toISOString(),
    })),
  };
}
