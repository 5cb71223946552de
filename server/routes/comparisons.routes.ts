import { comparisonParamsSchema, comparisonQuerySchema, comparisonSchema } from '@shared/schemas/comparisons';
import { defineRoute } from '../http/define-route';
import { labOf } from '../http/request-context';
import { comparisonCsv } from '../services/comparisons/comparison-csv';
import { compare } from '../services/comparisons/comparison.service';

export const comparisonRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/comparisons/:side/:compoundId',
    summary:
      'Every study of one emitter (or one quencher): kq, K_SV, driving force, flags, and a Rehm–Weller trend per solvent',
    tags: ['comparisons'],
    access: { lab: 'viewer' },
    request: { params: comparisonParamsSchema, query: comparisonQuerySchema },
    responses: {
      200: { description: 'The comparison', schema: comparisonSchema },
      404: { description: 'No such compound' },
    },
    handler: async ({ req, res, params, query }) => {
      res.json(await compare(labOf(req), params.side, params.compoundId, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/comparisons/:side/:compoundId/export.csv',
    summary: 'The comparison table as CSV',
    tags: ['comparisons'],
    access: { lab: 'viewer' },
    request: { params: comparisonParamsSchema, query: comparisonQuerySchema },
    responses: { 200: { description: 'text/csv' }, 404: { description: 'No such compound' } },
    handler: async ({ req, res, params, query }) => {
      const comparison = await compare(labOf(req), params.side, params.compoundId, query);
      res
        .attachment(`comparison-${comparison.compound.name.replace(/[^\w.-]+/g, '_')}.csv`)
        .type('text/csv')
        .send(comparisonCsv(comparison));
    },
  }),
];
