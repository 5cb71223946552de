import { labParamsSchema } from '@shared/schemas/members';
import { titrationPlanInputSchema, titrationPlanSchema } from '@shared/schemas/planner';
import { defineRoute } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { computeTitrationPlan, titrationPlanCsv } from '../services/planner/titration-plan.service';

export const plannerRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/titration-plans',
    summary: 'Plan a titration: each addition of stock in µL, the volumes and the concentrations reached',
    tags: ['planner'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, body: titrationPlanInputSchema },
    responses: {
      200: {
        description: 'The plan, with a warning when the emitter is diluted by more than about 10 %',
        schema: titrationPlanSchema,
      },
      400: { description: 'Missing values, or a target the stock cannot reach' },
    },
    handler: ({ res, body }) => {
      res.json(computeTitrationPlan(body));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/titration-plans/csv',
    summary: 'The same plan as a CSV file for the bench',
    tags: ['planner'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, body: titrationPlanInputSchema },
    responses: {
      200: { description: 'text/csv' },
      400: { description: 'Missing values, or a target the stock cannot reach' },
    },
    handler: ({ res, body }) => {
      const csv = titrationPlanCsv(body, computeTitrationPlan(body));
      sendDownload(res, { fileName: 'titration-plan.csv', type: 'text/csv', body: csv });
    },
  }),
];
