import type { Request } from 'express';
import type { Role } from '@shared/schemas/roles';
import { fixedStatement } from '../db/select-rows';

/** A person's membership of one lab, with what the access guard needs of the lab. */
export type MembershipRow = {
  id: string;
  role: Role;
  lab_id: string;
  lab_name: string;
  is_demo: boolean;
  require_two_factor: boolean;
};

/** The membership of a signed-in person in the lab of the request, as read with the session row. */
export interface MembershipReadWithSession {
  labId: string;
  /** Whose session the row was read for (null: the session was signed out). */
  userId: string | null;
  /** Null when that person is not a member of the lab. */
  membership: MembershipRow | null;
}

const uuid = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const labRoute = new RegExp(`^/api/labs/(${uuid})(?:[/?]|$)`, 'i');

/** The lab id of a route under /api/labs/:labId (null for any other address or a malformed id). */
export const labIdInUrl = (url: string): string | null => labRoute.exec(url)?.[1] ?? null;

/**
 * The session row and, in the same statement, the membership of the session's person in the lab
 * of the request: one round trip instead of two on every lab route. The session's conditions are
 * connect-pg-simple's own (sid, not expired), so a session ended or expired elsewhere is refused
 * exactly as before.
 */
export const sessionWithMembershipSql = fixedStatement(`
  SELECT s.sess, s.sess #>> '{passport,user}' AS session_user_id,
         m.id, m.role, l.id AS lab_id, l.name AS lab_name, l.is_demo, l.require_two_factor
  FROM sessions s
  LEFT JOIN memberships m ON m.lab_id = $3::uuid AND m.user_id = (s.sess #>> '{passport,user}')::uuid
  LEFT JOIN labs l ON l.id = m.lab_id
  WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`);

export type SessionWithMembershipRow = Partial<MembershipRow> & { sess: unknown; session_user_id: string | null };

const readWithSession = new WeakMap<Request, MembershipReadWithSession>();

/** Keeps what the session read found of the request's lab (see sessionWithMembershipSql). */
export function rememberMembership(req: Request, labId: string, row: SessionWithMembershipRow): void {
  const { id, role, lab_id, lab_name, is_demo, require_two_factor } = row;
  readWithSession.set(req, {
    labId,
    userId: row.session_user_id,
    // The LEFT JOINs give a membership's columns all together, or none (labs are its foreign key).
    membership: id ? ({ id, role, lab_id, lab_name, is_demo, require_two_factor } as MembershipRow) : null,
  });
}

/**
 * The membership read with this request's session row, when it answers for this lab and this
 * person (a request that signed in or out since has another person: it is asked again).
 */
export function membershipReadWithSession(
  req: Request,
  labId: string,
  userId: string,
): { membership: MembershipRow | null } | undefined {
  const read = readWithSession.get(req);
  if (!read || read.labId.toLowerCase() !== labId.toLowerCase() || read.userId !== userId) return undefined;
  return { membership: read.membership };
}
