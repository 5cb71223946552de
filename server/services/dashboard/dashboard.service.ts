import type { Dashboard, DashboardStudy } from '@shared/schemas/dashboard';
import { roleAtLeast } from '@shared/schemas/roles';
import { selectRows } from '../../db/select-rows';
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
 * One list of the lab's current studies, newest change first, with the names beside them. Each
 * list is a part of one UNION ALL, so the four lists cost one round trip (every filter starts with
 * lab_id and is_current, as the indexes of migration 0005 do).
 */
const listPart = (list: ListName, condition: string, limit: number) => `(
  SELECT '${list}' AS list, s.id, s.title, s.status, s.kq, s.flagged, s.updated_at,
         e.name AS emitter, q.name AS quencher, o.name AS owner
  FROM studies s
  LEFT JOIN compounds e ON e.id = s.emitter_id
  LEFT JOIN compounds q ON q.id = s.quencher_id
  LEFT JOIN users o ON o.id = s.owner_id
  WHERE s.lab_id = $1 AND s.is_current AND ${condition}
  ORDER BY s.updated_at DESC
  LIMIT ${limit})`;

/**
 * The lab's last 20 events with who did them and the title of what they touched. Sign-ins are not
 * lab news, and the automatic refit after each edit would drown the rest.
 */
const eventsSql = `
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
  ORDER BY ev.id DESC`;

/** The landing screen of a lab: what waits for me, what came back to me, what looks wrong, what happened. */
export async function getDashboard(lab: LabContext, userId: string): Promise<Dashboard> {
  const sequelize = Study.sequelize!;
  const parts = [
    ...(roleAtLeast(lab.role, 'reviewer') ? [listPart('waitingForMyReview', "s.status = 'submitted'", 10)] : []),
    listPart('myReturned', "s.status = 'returned' AND s.owner_id = $2", 10),
    listPart('myDrafts', "s.status = 'draft' AND s.owner_id = $2", 6),
    listPart('recentlyFlagged', 's.flagged', 8),
  ];
  // Two round trips, asked together: the screen waits for the slower one only.
  const [listRows, events] = await Promise.all([
    selectRows<ListRow>(sequelize, parts.join('\nUNION ALL\n'), [lab.id, userId]),
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
