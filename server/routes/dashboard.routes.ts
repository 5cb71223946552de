import { dashboardSchema } from '@shared/schemas/dashboard';
import { labParamsSchema } from '@shared/schemas/members';
import { defineRoute } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import { getDashboard } from '../services/dashboard/dashboard.service';

export const dashboardRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/dashboard',
    summary: 'Studies waiting for my review, my returned studies, recently flagged results and recent activity',
    tags: ['dashboard'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'The dashboard', schema: dashboardSchema } },
    handler: async ({ req, res }) => {
      res.json(await getDashboard(labOf(req), signedInActor(req).userId));
    },
  }),
];
