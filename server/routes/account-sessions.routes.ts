import { accountSessionParamsSchema, accountSessionsSchema } from '@shared/schemas/auth';
import { defineRoute } from '../http/define-route';
import { signedInActor } from '../http/request-context';
import { endAccountSession, endOtherAccountSessions, listAccountSessions } from '../services/account-sessions.service';

export const accountSessionRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/account/sessions',
    summary: 'My open sessions (browsers signed in as me), the current one marked',
    tags: ['account'],
    access: 'signed-in',
    responses: {
      200: { description: 'Open sessions', schema: accountSessionsSchema },
      401: { description: 'Not signed in' },
    },
    handler: async ({ req, res }) => {
      const { userId } = signedInActor(req);
      res.json(await listAccountSessions(req.app.locals.services.sequelize, userId, req.sessionID));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/account/sessions',
    summary: 'End every session of mine except this one',
    tags: ['account'],
    access: 'signed-in',
    responses: { 204: { description: 'Ended' }, 401: { description: 'Not signed in' } },
    handler: async ({ req, res }) => {
      await endOtherAccountSessions(req.app.locals.services.sequelize, signedInActor(req), req.sessionID);
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/account/sessions/:sessionId',
    summary: 'End one of my other sessions',
    tags: ['account'],
    access: 'signed-in',
    request: { params: accountSessionParamsSchema },
    responses: {
      204: { description: 'Ended' },
      400: { description: 'Not a session id' },
      401: { description: 'Not signed in' },
      404: { description: 'No such session of mine' },
      409: { description: 'That is the current session: sign out instead' },
    },
    handler: async ({ req, res, params }) => {
      await endAccountSession(req.app.locals.services.sequelize, signedInActor(req), req.sessionID, params.sessionId);
      res.status(204).end();
    },
  }),
];
