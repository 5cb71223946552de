import type { Request, Response } from 'express';
import { csrfTokenSchema, sessionSchema, signInSchema } from '@shared/schemas/auth';
import type { Session } from '@shared/schemas/auth';
import { defineRoute } from '../http/define-route';
import { actorOf, signedInActor } from '../http/request-context';
import { AppError } from '../lib/app-error';
import { User } from '../models';
import { recordAudit } from '../services/audit.service';
import { loadSessionUser } from '../services/session-user.service';

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
  return {
    user: await loadSessionUser(userId),
    // A new session (just signed in) needs a new token; otherwise the current one stays valid.
    csrfToken: generateCsrfToken(req, res, { overwrite: options.newSession }),
    mailCatcher,
  };
}

/**
 * Signs the user in on this request; passport regenerates the session id (no fixation). The
 * session notes when and from where, for the absolute lifetime and the list of my sessions.
 */
export async function logIn(req: Request, userId: string): Promise<void> {
  await new Promise<void>((resolve, reject) =>
    req.logIn({ id: userId }, (error) => (error ? reject(error) : resolve())),
  );
  req.session.signedInAt = Date.now();
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
      await logIn(req, user.id);
      await User.update({ lastSignInAt: new Date() }, { where: { id: user.id } });
      await recordAudit(signedInActor(req), { action: 'sign_in', targetType: 'user', targetId: user.id });
      res.json(await sessionResponse(req, res, user.id, { newSession: true }));
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
