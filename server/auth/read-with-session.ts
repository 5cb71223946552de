import type { Request } from 'express';
import { fixedStatement, type FixedStatement } from '../db/select-rows';
import {
  sessionStateSelect,
  toSessionState,
  type SessionState,
  type SessionStateRow,
} from '../services/session-user.service';
import {
  labIdInUrl,
  rememberMembership,
  sessionWithMembershipSql,
  type SessionWithMembershipRow,
} from './session-membership';

/** What a request reads in the same statement as its session row (server/auth/session.ts). */
export interface ReadWithSession {
  /** Starts with the session row's columns (sess, session_user_id) under connect-pg-simple's conditions. */
  sql: FixedStatement;
  /** The binds after the session's own: $1 the session id, $2 now in seconds. */
  values: unknown[];
  /** Keeps, for the request, what the row holds besides the session. */
  remember(row: Record<string, unknown>): void;
}

/**
 * GET /api/session, which every screen asks first: the session row and, in the same statement,
 * the person's session state (server/services/session-user.service.ts) for the person the session
 * names, so the answer costs one round trip instead of two.
 */
export const sessionWithStateSql = fixedStatement(`
  SELECT s.sess, s.sess #>> '{passport,user}' AS session_user_id, st.*
  FROM sessions s
  LEFT JOIN LATERAL (${sessionStateSelect("(s.sess #>> '{passport,user}')::uuid")}) st ON true
  WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`);

type SessionWithStateRow = Partial<SessionStateRow> & { sess: unknown; session_user_id: string | null };

const stateReadWithSession = new WeakMap<Request, { userId: string | null; row: SessionStateRow | undefined }>();

const sessionAddress = /^\/api\/session(?:\?|$)/;

/** The read to make with this request's session row, if any: its lab membership, or its session state. */
export function readWithSessionFor(req: Request): ReadWithSession | undefined {
  const labId = labIdInUrl(req.originalUrl);
  if (labId) {
    return {
      sql: sessionWithMembershipSql,
      values: [labId],
      remember: (row) => rememberMembership(req, labId, row as SessionWithMembershipRow),
    };
  }
  if (req.method === 'GET' && sessionAddress.test(req.originalUrl)) {
    return {
      sql: sessionWithStateSql,
      values: [],
      remember: (row) => {
        const { sess: _sess, session_user_id, ...state } = row as SessionWithStateRow;
        // The LATERAL join gives the person's columns all together, or none (no such person).
        stateReadWithSession.set(req, {
          userId: session_user_id,
          row: state.id ? (state as SessionStateRow) : undefined,
        });
      },
    };
  }
  return undefined;
}

/**
 * The session state read with this request's session row, when it was read for this person (401
 * when the person no longer exists, as loadSessionState answers); undefined when it was not read.
 */
export function sessionStateReadWithSession(req: Request, userId: string): SessionState | undefined {
  const read = stateReadWithSession.get(req);
  if (!read || read.userId !== userId) return undefined;
  return toSessionState(read.row);
}
