import { labParamsSchema } from '@shared/schemas/members';
import {
  temperatureSeriesAnalysisSchema,
  temperatureSeriesListSchema,
  temperatureSeriesQuerySchema,
} from '@shared/schemas/temperature-series';
import { defineRoute } from '../http/define-route';
import { labOf } from '../http/request-context';
import { analyseSeries, listTemperatureSeries } from '../services/mechanism/temperature-series.service';

export const mechanismRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/temperature-series',
    summary: "The lab's studies grouped by emitter, quencher and solvent where they span two or more temperatures",
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'Candidate temperature series', schema: temperatureSeriesListSchema } },
    handler: async ({ req, res }) => {
      res.json(await listTemperatureSeries(labOf(req)));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/temperature-series/analysis',
    summary:
      'Static or dynamic from temperature: K_SV(T) against T/eta(T), Arrhenius and Eyring fits of kq, the solvent viscous-flow energy',
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, query: temperatureSeriesQuerySchema },
    responses: {
      200: { description: 'Verdict with its numbers', schema: temperatureSeriesAnalysisSchema },
      400: {
        description:
          'Fewer than 3 temperatures, more than one pair or solvent, a study without a fit or without a viscosity',
      },
      404: { description: 'A study id that is not in this lab' },
    },
    handler: async ({ req, res, query }) => {
      res.json(await analyseSeries(labOf(req), query.studies));
    },
  }),
];
