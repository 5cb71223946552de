import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas/roles';
import { roleAtLeast } from '@shared/schemas/roles';
import { membershipReadWithSession, type MembershipRow } from '../auth/session-membership';
import { fixedStatement, selectRows } from '../db/select-rows';
import { AppError } from '../lib/app-error';
import { Membership } from '../models';

/** 401 JSON for a signed-out request (never a redirect). */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
  next();
};

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const labNotFound = () => new AppError('not_found', 'No such lab, or you are not a member of it.', 404);

const membershipSql = fixedStatement(`
  SELECT m.id, m.role, l.id AS lab_id, l.name AS lab_name, l.is_demo, l.require_two_factor
  FROM memberships m JOIN labs l ON l.id = m.lab_id
  WHERE m.lab_id = $1 AND m.user_id = $2`);

/**
 * Resolves :labId, checks that the signed-in person is a member (404 otherwise, so a lab's
 * existence is not revealed) and that their role there is at least `needed` (403).
 */
export function requireLabRole(needed: Role): RequestHandler {
  return async (req, _res, next) => {
    const labId = String(req.params.labId ?? '');
    if (!req.user) throw new AppError('not_signed_in', 'Sign in to use this part of Halflight.', 401);
    if (!uuidPattern.test(labId)) throw labNotFound();
    // Read with the session row on every lab route (server/auth/session.ts); asked here only when
    // it was not: one prepared statement, no query building or model instances.
    const read = membershipReadWithSession(req, labId, req.user.id);
    const membership = read
      ? read.membership
      : (await selectRows<MembershipRow>(Membership.sequelize!, membershipSql, [labId, req.user.id]))[0];
    if (!membership) throw labNotFound();
    if (!roleAtLeast(membership.role, needed)) {
      throw new AppError(
        'forbidden',
        `Your role in this lab (${membership.role}) cannot do this; it needs ${needed} or higher.`,
        403,
      );
    }
    // A lab may require a second sign-in step of the people who approve and administer.
    if (membership.require_two_factor && roleAtLeast(membership.role, 'reviewer') && !req.session?.twoFactorVerified) {
      throw new AppError(
        'two_factor_required',
        'This lab requires two-step sign-in of its admins and reviewers. Turn it on under Account (if it is on ' +
          'already, sign out and sign in again with your code).',
        403,
      );
    }
    req.lab = {
      id: membership.lab_id,
      name: membership.lab_name,
      isDemo: membership.is_demo,
      role: membership.role,
      membershipId: membership.id,
    };
    next();
  };
}
