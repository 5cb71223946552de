import type { Request, Response } from 'express';
import { csrfTokenSchema, sessionSchema, signInSchema } from '@shared/schemas/auth';
import type { Session } from '@shared/schemas/auth';
import { secondStepNeededSchema, secondStepSchema } from '@shared/schemas/two-factor';
import type { SecondStepNeeded } from '@shared/schemas/two-factor';
import { sessionStateReadWithSession } from '../auth/read-with-session';
import { defineRoute } from '../http/define-route';
import { actorOf, signedInActor } from '../http/request-context';
import { AppError } from '../lib/app-error';
import { User } from '../models';
import { recordAudit } from '../services/audit.service';
import { loadSessionState } from '../services/session-user.service';
import { checkSecondStep } from '../services/two-factor.service';

function authenticate(req: Request, res: Response): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    req.app.locals.services.passport.authenticate(
      'local',
      { session: false },
      (error: unknown, user: Express.User | false) => (error ? reject(error) : resolve(user)),
    )(req, res, reject);
  });
}

/** The session answer: who is signed in, and a CSRF token bound to this (possibly new) session. */
export async function sessionResponse(
  req: Request,
  res: Response,
  userId: string,
  options: { newSession: boolean },
): Promise<Session> {
  const { generateCsrfToken, mailCatcher } = req.app.locals.services;
  // GET /api/session has it from the statement that read the session row (read-with-session.ts).
  const { user, twoFactorEnabled, recoveryCodesLeft } =
    sessionStateReadWithSession(req, userId) ?? (await loadSessionState(userId));
  return {
    user,
    // A new session (just signed in) needs a new token; otherwise the current one stays valid.
    csrfToken: generateCsrfToken(req, res, { overwrite: options.newSession }),
    mailCatcher,
    twoFactor: {
      enabled: twoFactorEnabled,
      verified: req.session.twoFactorVerified === true,
      recoveryCodesLeft,
    },
  };
}

const secondStepWindowMs = 5 * 60_000;

/**
 * After the right password: signs in at once, or, when the person has two-step sign-in on,
 * starts a fresh session that waits (five minutes) for the second step.
 */
export async function completeFirstStep(req: Request, res: Response, userId: string): Promise<void> {
  const user = await User.findByPk(userId, { attributes: ['id', 'totpEnabledAt'] });
  if (user?.totpEnabledAt) {
    await new Promise<void>((resolve, reject) =>
      req.session.regenerate((error) => (error ? reject(error) : resolve())),
    );
    req.session.twoFactorPending = { userId, since: Date.now() };
    const csrfToken = req.app.locals.services.generateCsrfToken(req, res, { overwrite: true });
    res.status(202).json({ twoFactorRequired: true, csrfToken } satisfies SecondStepNeeded);
    return;
  }
  await logIn(req, userId);
  res.json(await sessionResponse(req, res, userId, { newSession: true }));
}

/**
 * Signs the user in on this request; passport regenerates the session id (no fixation). The
 * session notes when and from where, for the absolute lifetime and the list of my sessions.
 */
export async function logIn(
  req: Request,
  userId: string,
  options: { twoFactorVerified?: boolean } = {},
): Promise<void> {
  await new Promise<void>((resolve, reject) =>
    req.logIn({ id: userId }, (error) => (error ? reject(error) : resolve())),
  );
  req.session.signedInAt = Date.now();
  req.session.twoFactorVerified = options.twoFactorVerified ?? false;
  req.session.userAgent = String(req.headers['user-agent'] ?? '').slice(0, 300);
  req.session.ip = req.ip ?? '';
}

export const sessionRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/csrf-token',
    summary: 'A CSRF token for this browser session; send it as x-csrf-token on every change',
    tags: ['session'],
    access: 'public',
    responses: { 200: { description: 'The token', schema: csrfTokenSchema } },
    handler: ({ req, res }) => {
      // Storing a mark keeps an anonymous session alive, so the token stays bound to one id.
      req.session.csrfIssued = true;
      res.json({ csrfToken: req.app.locals.services.generateCsrfToken(req, res) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/session',
    summary: 'Sign in with e-mail and password',
    tags: ['session'],
    access: 'public',
    rateLimit: 'signIn',
    request: { body: signInSchema },
    responses: {
      200: { description: 'Signed in', schema: sessionSchema },
      202: {
        description: 'Password right; the second step is needed (POST /api/session/second-step)',
        schema: secondStepNeededSchema,
      },
      400: { description: 'Missing or malformed fields' },
      401: { description: 'Wrong e-mail or password (one message for both)' },
      429: {
        description:
          'Too many failed attempts from this address or for this account, or too much password work at once',
      },
      503: { description: 'Busy checking other passwords; try again in a few seconds' },
    },
    handler: async ({ req, res, body }) => {
      const { rateLimits } = req.app.locals.services;
      const user = await authenticate(req, res);
      if (!user) {
        // Only failures count: the address and the account each have a budget (rate-limits.ts).
        await rateLimits.signInFailed(req, body.email);
        await recordAudit(actorOf(req), { action: 'sign_in_failed', details: { email: body.email } });
        throw new AppError('invalid_credentials', 'The e-mail address or the password is not right.', 401);
      }
      await rateLimits.signInSucceeded(body.email);
      await User.update({ lastSignInAt: new Date() }, { where: { id: user.id } });
      await recordAudit(
        { userId: user.id, ip: req.ip ?? null },
        { action: 'sign_in', targetType: 'user', targetId: user.id },
      );
      await completeFirstStep(req, res, user.id);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/session/second-step',
    summary: 'Finish a sign-in with the code from the authenticator app, or one recovery code',
    tags: ['session'],
    access: 'public',
    rateLimit: 'twoFactor',
    request: { body: secondStepSchema },
    responses: {
      200: { description: 'Signed in', schema: sessionSchema },
      400: { description: 'Neither a 6-digit code nor a recovery code' },
      401: { description: 'Wrong code, or no sign-in waiting for a second step (start again)' },
      429: { description: 'Too many wrong codes' },
    },
    handler: async ({ req, res, body }) => {
      const { sequelize, rateLimits } = req.app.locals.services;
      const pending = req.session.twoFactorPending;
      if (!pending || Date.now() - pending.since > secondStepWindowMs) {
        throw new AppError(
          'no_sign_in_waiting',
          'No sign-in is waiting for a code here. Start again with your password.',
          401,
        );
      }
      await rateLimits.assertRoom('twoFactorFailuresPerAccount', pending.userId);
      const matched = await checkSecondStep(sequelize, pending.userId, body);
      if (!matched) {
        await rateLimits.spend('twoFactorFailuresPerAccount', pending.userId);
        await rateLimits.signInFailed(req, null);
        await recordAudit(actorOf(req), { action: 'second_step_failed', targetType: 'user', targetId: pending.userId });
        throw new AppError(
          'wrong_code',
          'That code is not right. Use the newest code your app shows, or a recovery code.',
          401,
        );
      }
      await rateLimits.signInSucceeded(pending.userId);
      await logIn(req, pending.userId, { twoFactorVerified: true });
      await recordAudit(signedInActor(req), {
        action: 'second_step_passed',
        targetType: 'user',
        targetId: pending.userId,
        details: { with: matched },
      });
      res.json(await sessionResponse(req, res, pending.userId, { newSession: true }));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/session',
    summary: 'The signed-in person with their labs and roles',
    tags: ['session'],
    access: 'signed-in',
    responses: {
      200: { description: 'Signed in', schema: sessionSchema },
      401: { description: 'Not signed in' },
    },
    handler: async ({ req, res }) => {
      res.json(await sessionResponse(req, res, signedInActor(req).userId, { newSession: false }));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/session',
    summary: 'Sign out: the session is destroyed',
    tags: ['session'],
    access: 'signed-in',
    responses: { 204: { description: 'Signed out' }, 401: { description: 'Not signed in' } },
    handler: async ({ req, res }) => {
      const actor = signedInActor(req);
      await recordAudit(actor, { action: 'sign_out', targetType: 'user', targetId: actor.userId });
      await new Promise<void>((resolve, reject) => req.logOut((error) => (error ? reject(error) : resolve())));
      await new Promise<void>((resolve, reject) => req.session.destroy((error) => (error ? reject(error) : resolve())));
      res.clearCookie(req.app.locals.services.sessionCookieName);
      res.status(204).end();
    },
  }),
];
