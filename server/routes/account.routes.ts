import {
  changePasswordSchema,
  completePasswordResetSchema,
  messageSchema,
  requestPasswordResetSchema,
  sessionSchema,
  sessionUserSchema,
  updateProfileSchema,
} from '@shared/schemas/auth';
import { endSessionsOf } from '../auth/session-records';
import { defineRoute } from '../http/define-route';
import { AppError } from '../lib/app-error';
import { actorOf, signedInActor } from '../http/request-context';
import { User } from '../models';
import { changePassword, completePasswordReset, requestPasswordReset } from '../services/account.service';
import { loadSessionUser } from '../services/session-user.service';
import { logIn, sessionResponse } from './session.routes';

export const accountRoutes = [
  defineRoute({
    method: 'patch',
    path: '/api/account',
    summary: "Change the signed-in person's display name",
    tags: ['account'],
    access: 'signed-in',
    request: { body: updateProfileSchema },
    responses: {
      200: { description: 'Updated', schema: sessionUserSchema },
      400: { description: 'Invalid name' },
      401: { description: 'Not signed in' },
    },
    handler: async ({ req, res, body }) => {
      const { userId } = signedInActor(req);
      await User.update({ name: body.name }, { where: { id: userId } });
      res.json(await loadSessionUser(userId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/account/password',
    summary: 'Change the password, proving the current one',
    tags: ['account'],
    access: 'signed-in',
    rateLimit: 'signIn',
    request: { body: changePasswordSchema },
    responses: {
      200: {
        description: 'Changed; this session continues under a new id (new CSRF token), every other session ended',
        schema: sessionSchema,
      },
      400: { description: 'Current password wrong, or new password too weak' },
      401: { description: 'Not signed in' },
    },
    handler: async ({ req, res, body }) => {
      const actor = signedInActor(req);
      await changePassword(actor.userId, body, actor).catch(async (error) => {
        if (error instanceof AppError && error.code === 'wrong_password') {
          await req.app.locals.services.rateLimits.signInFailed(req, null);
        }
        throw error;
      });
      // This browser stays signed in under a new session id; every other session of the person ends.
      await logIn(req, actor.userId);
      await endSessionsOf(req.app.locals.services.sequelize, actor.userId, { keepSid: req.sessionID });
      res.json(await sessionResponse(req, res, actor.userId, { newSession: true }));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/password-resets',
    summary: 'Mail a one-hour, single-use link to set a new password (same answer for any address)',
    tags: ['account'],
    access: 'public',
    rateLimit: 'passwordReset',
    request: { body: requestPasswordResetSchema },
    responses: {
      202: { description: 'Accepted', schema: messageSchema },
      400: { description: 'Not an e-mail address' },
      429: { description: 'Too many requests' },
    },
    handler: async ({ req, res, body }) => {
      await requestPasswordReset(body.email, { actor: actorOf(req), jobs: req.app.locals.services.jobs });
      res.status(202).json({
        message: 'If this address has a Halflight account, a link to set a new password is on its way.',
      });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/password-resets/complete',
    summary: 'Set a new password with the token from the e-mailed link',
    tags: ['account'],
    access: 'public',
    rateLimit: 'passwordResetCompletion',
    request: { body: completePasswordResetSchema },
    responses: {
      204: { description: 'Password set' },
      400: { description: 'Token expired, used or malformed; or password too weak' },
    },
    handler: async ({ req, res, body }) => {
      await completePasswordReset(req.app.locals.services.sequelize, body, actorOf(req));
      res.status(204).end();
    },
  }),
];
