import type { Sequelize } from 'sequelize';
import type { AccountSessions } from '@shared/schemas/auth';
import { endSessionsOf, publicSessionId, sessionsOf } from '../auth/session-records';
import { sessionAbsoluteMs, sessionIdleMs } from '../auth/session';
import { AppError } from '../lib/app-error';
import type { SignedInActor } from '../domain/actor';
import { recordAudit } from './audit.service';

/** The person's open sessions, newest activity first, the current one marked. */
export async function listAccountSessions(
  sequelize: Sequelize,
  userId: string,
  currentSid: string,
): Promise<AccountSessions> {
  const sessions = await sessionsOf(sequelize, userId);
  return {
    items: sessions.map((session) => ({
      id: publicSessionId(session.sid),
      current: session.sid === currentSid,
      signedInAt: session.signedInAt ? new Date(session.signedInAt).toISOString() : null,
      // The expiry slides with use (at most five minutes behind): expiry minus the idle timeout is
      // when the latest request came, to within those five minutes.
      lastActiveAt: new Date(session.expire.getTime() - sessionIdleMs).toISOString(),
      endsAt: new Date(
        Math.min(session.expire.getTime(), (session.signedInAt ?? Date.now()) + sessionAbsoluteMs),
      ).toISOString(),
      userAgent: session.userAgent,
      ip: session.ip,
    })),
  };
}

/** Ends one of my other sessions; the current one ends by signing out. */
export async function endAccountSession(
  sequelize: Sequelize,
  actor: SignedInActor,
  currentSid: string,
  sessionId: string,
): Promise<void> {
  const target = (await sessionsOf(sequelize, actor.userId)).find(
    (session) => publicSessionId(session.sid) === sessionId,
  );
  if (!target) throw new AppError('not_found', 'No such session of yours; it may have ended already.', 404);
  if (target.sid === currentSid) {
    throw new AppError('current_session', 'This is the session you are using; sign out to end it.', 409);
  }
  await sequelize.query('DELETE FROM sessions WHERE sid = :sid', { replacements: { sid: target.sid } });
  await recordAudit(actor, {
    action: 'session_ended',
    targetType: 'user',
    targetId: actor.userId,
    details: { sessionId },
  });
}

/** Ends every session of mine except this one. */
export async function endOtherAccountSessions(
  sequelize: Sequelize,
  actor: SignedInActor,
  currentSid: string,
): Promise<number> {
  const ended = await endSessionsOf(sequelize, actor.userId, { keepSid: currentSid });
  await recordAudit(actor, {
    action: 'sessions_ended',
    targetType: 'user',
    targetId: actor.userId,
    details: { count: ended },
  });
  return ended;
}
