import type { SessionUser } from '@shared/schemas/auth';
import { fixedStatement, selectRows } from '../db/select-rows';
import { AppError } from '../lib/app-error';
import { User } from '../models';

export interface SessionState {
  user: SessionUser;
  twoFactorEnabled: boolean;
  /** Unused recovery codes (0 while two-step sign-in is off). */
  recoveryCodesLeft: number;
}

/** A person's session state as one row (labs as JSON built by PostgreSQL). */
export type SessionStateRow = {
  id: string;
  email: string;
  name: string;
  two_factor_enabled: boolean;
  recovery_codes_left: number;
  labs: SessionUser['labs'];
};

/**
 * The person, their labs (by name) and their two-step state in one SELECT, for the user id that
 * `userId` gives: a bind ($1), or an expression of a statement that reads it with something else
 * (the session row, server/auth/read-with-session.ts).
 */
export const sessionStateSelect = (userId: string) => `
  SELECT u.id, u.email, u.name, u.totp_enabled_at IS NOT NULL AS two_factor_enabled,
         CASE WHEN u.totp_enabled_at IS NULL THEN 0 ELSE
           (SELECT count(*)::int FROM recovery_codes r WHERE r.user_id = u.id AND r.used_at IS NULL) END
           AS recovery_codes_left,
         COALESCE((
           SELECT json_agg(json_build_object('labId', l.id, 'labName', l.name, 'isDemo', l.is_demo,
                                             'role', m.role, 'requireTwoFactor', l.require_two_factor)
                           ORDER BY l.name, l.id)
           FROM memberships m JOIN labs l ON l.id = m.lab_id
           WHERE m.user_id = u.id), '[]'::json) AS labs
  FROM users u
  WHERE u.id = ${userId}`;

// Every screen asks for the session first: one statement, prepared (a lookup by key).
const stateSql = fixedStatement(sessionStateSelect('$1'));

/** The session state of a row (401 when there is none: the person no longer exists). */
export function toSessionState(row: SessionStateRow | undefined): SessionState {
  if (!row) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
  return {
    user: { id: row.id, email: row.email, name: row.name, labs: row.labs },
    twoFactorEnabled: row.two_factor_enabled,
    recoveryCodesLeft: row.recovery_codes_left,
  };
}

/** The signed-in person with every lab they belong to, their role there and their two-step state. */
export async function loadSessionState(userId: string): Promise<SessionState> {
  const [row] = await selectRows<SessionStateRow>(User.sequelize!, stateSql, [userId]);
  return toSessionState(row);
}

/** The signed-in person with every lab they belong to and their role there. */
export async function loadSessionUser(userId: string): Promise<SessionUser> {
  return (await loadSessionState(userId)).user;
}
