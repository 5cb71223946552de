import {
  changeRoleSchema,
  invitationParamsSchema,
  inviteMemberSchema,
  labParamsSchema,
  memberParamsSchema,
  memberSchema,
  membersListSchema,
  pendingInvitationSchema,
} from '@shared/schemas/members';
import { defineRoute } from '../http/define-route';
import { actorOf, labOf, signedInActor } from '../http/request-context';
import { inviteMember, revokeInvitation } from '../services/invitations.service';
import { changeMemberRole, listMembers, removeMember } from '../services/members.service';

export const memberRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/members',
    summary: 'Members of the lab with their roles; admins also get the open invitations',
    tags: ['members'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'Members', schema: membersListSchema }, 404: { description: 'Not your lab' } },
    handler: async ({ req, res }) => {
      res.json(await listMembers(labOf(req)));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/invitations',
    summary: 'Invite an e-mail address to the lab with a role (mailed link, single use, 7 days)',
    tags: ['members'],
    access: { lab: 'admin' },
    rateLimit: 'invitation',
    request: { params: labParamsSchema, body: inviteMemberSchema },
    responses: {
      201: { description: 'Invitation sent', schema: pendingInvitationSchema },
      400: { description: 'Invalid e-mail or role' },
      409: { description: 'Already a member, or already invited' },
    },
    handler: async ({ req, res, body }) => {
      const { sequelize, jobs } = req.app.locals.services;
      res.status(201).json(await inviteMember(sequelize, labOf(req), body, { actor: signedInActor(req), jobs }));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/invitations/:invitationId',
    summary: 'Revoke an open invitation',
    tags: ['members'],
    access: { lab: 'admin' },
    request: { params: invitationParamsSchema },
    responses: { 204: { description: 'Revoked' }, 404: { description: 'No open invitation with this id' } },
    handler: async ({ req, res, params }) => {
      await revokeInvitation(labOf(req), params.invitationId, actorOf(req));
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/labs/:labId/members/:memberId',
    summary: "Change a member's role (the last admin cannot be demoted)",
    tags: ['members'],
    access: { lab: 'admin' },
    request: { params: memberParamsSchema, body: changeRoleSchema },
    responses: {
      200: { description: 'Role changed', schema: memberSchema },
      404: { description: 'No such member in this lab' },
      409: { description: 'Would leave the lab without an admin' },
    },
    handler: async ({ req, res, params, body }) => {
      const { sequelize } = req.app.locals.services;
      res.json(await changeMemberRole(sequelize, labOf(req), params.memberId, body.role, actorOf(req)));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/members/:memberId',
    summary: 'Remove a member from the lab (the last admin cannot be removed)',
    tags: ['members'],
    access: { lab: 'admin' },
    request: { params: memberParamsSchema },
    responses: {
      204: { description: 'Removed' },
      404: { description: 'No such member in this lab' },
      409: { description: 'Would leave the lab without an admin' },
    },
    handler: async ({ req, res, params }) => {
      await removeMember(req.app.locals.services.sequelize, labOf(req), params.memberId, actorOf(req));
      res.status(204).end();
    },
  }),
];
