import { z } from 'zod';
import { acceptInvitationSchema, invitationPreviewSchema, sessionSchema } from '@shared/schemas/auth';
import { secondStepNeededSchema } from '@shared/schemas/two-factor';
import { defineRoute } from '../http/define-route';
import { AppError } from '../lib/app-error';
import { acceptInvitation, previewInvitation } from '../services/invitations.service';
import { completeFirstStep } from './session.routes';

const tokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'is not a valid invitation token') });

export const invitationRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/invitations/:token',
    summary: 'What an invitation link offers: lab, role, inviter, expiry',
    tags: ['invitations'],
    access: 'public',
    request: { params: tokenParams },
    responses: {
      200: { description: 'Open invitation', schema: invitationPreviewSchema },
      404: { description: 'Expired, revoked, used or unknown' },
    },
    handler: async ({ res, params }) => {
      res.json(await previewInvitation(params.token));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/invitations/:token/accept',
    summary: 'Accept an invitation (new person: name and password; existing account: its password) and sign in',
    tags: ['invitations'],
    access: 'public',
    rateLimit: 'signIn',
    request: { params: tokenParams, body: acceptInvitationSchema },
    responses: {
      200: { description: 'Joined the lab and signed in', schema: sessionSchema },
      202: {
        description: 'Joined; the account has two-step sign-in, so the second step follows',
        schema: secondStepNeededSchema,
      },
      400: { description: 'Missing name or weak password' },
      401: { description: 'Wrong password for the existing account' },
      404: { description: 'Expired, revoked, used or unknown' },
    },
    handler: async ({ req, res, params, body }) => {
      const { sequelize, rateLimits } = req.app.locals.services;
      const userId = await acceptInvitation(sequelize, params.token, body, req.ip ?? null).catch(async (error) => {
        if (error instanceof AppError && error.code === 'invalid_credentials') await rateLimits.signInFailed(req, null);
        throw error;
      });
      // With two-step sign-in on, joining still needs the second step before the session is signed in.
      await completeFirstStep(req, res, userId);
    },
  }),
];
