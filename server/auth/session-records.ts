import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';

/**
 * Queries over the sessions table of connect-pg-simple (sid, sess JSON, expire). passport keeps
 * the signed-in person's id at sess.passport.user; we add signedInAt, userAgent and ip at sign-in.
 * A session's public id is a hash of its sid, so the sid (the cookie's secret) never leaves.
 */
export const publicSessionId = (sid: string) => crypto.createHash('sha256').update(sid).digest('hex').slice(0, 32);

export interface SessionRecord {
  sid: string;
  signedInAt: number | null;
  userAgent: string | null;
  ip: string | null;
  expire: Date;
}

export async function sessionsOf(sequelize: Sequelize, userId: string): Promise<SessionRecord[]> {
  const rows = await sequelize.query<{ sid: string; sess: Record<string, unknown>; expire: Date }>(
    `SELECT sid, sess, expire FROM sessions WHERE sess->'passport'->>'user' = :userId AND expire > now()
     ORDER BY expire DESC`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  return rows.map((row) => ({
    sid: row.sid,
    signedInAt: typeof row.sess.signedInAt === 'number' ? row.sess.signedInAt : null,
    userAgent: typeof row.sess.userAgent === 'string' ? row.sess.userAgent : null,
    ip: typeof row.sess.ip === 'string' ? row.sess.ip : null,
    expire: new Date(row.expire),
  }));
}

/** Ends every session of the person, except `keepSid` when given; returns how many ended. */
export async function endSessionsOf(
  sequelize: Sequelize,
  userId: string,
  options: { keepSid?: string; transaction?: Transaction } = {},
): Promise<number> {
  const [, result] = await sequelize.query(
    `DELETE FROM sessions WHERE sess->'passport'->>'user' = :userId AND sid <> :keep`,
    { replacements: { userId, keep: options.keepSid ?? '' }, transaction: options.transaction },
  );
  return (result as { rowCount?: number } | null)?.rowCount ?? 0;
}
