import { z } from 'zod';
import { healthSchema } from '@shared/schemas/health';
import { databaseRetryAfterSeconds } from '../db/unavailable';
import { defineRoute } from '../http/define-route';
import { checkHealth } from '../services/health.service';

export const systemRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/health',
    summary: 'Reports the API and a live round trip to the database',
    tags: ['system'],
    access: 'public',
    responses: {
      200: { description: 'API and database are up', schema: healthSchema },
      503: { description: 'The database did not answer', schema: healthSchema },
    },
    handler: async ({ req, res }) => {
      const { sequelize, embeddedDatabase } = req.app.locals.services;
      // req.log is read only when the check fails: a request's logger is made when first asked for.
      const health = await checkHealth(sequelize, embeddedDatabase, (error) =>
        req.log.error({ err: error }, 'health check query failed'),
      );
      const up = health.database.status === 'up';
      if (!up) res.setHeader('Retry-After', String(databaseRetryAfterSeconds));
      res.status(up ? 200 : 503).json(health);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/openapi.json',
    summary: 'This API described as an OpenAPI 3.1 document, generated from the shared zod schemas',
    tags: ['system'],
    access: 'public',
    responses: {
      200: { description: 'The OpenAPI document', schema: z.record(z.string(), z.unknown()) },
    },
    handler: ({ req, res }) => {
      res.json(req.app.locals.openApiDocument);
    },
  }),
];
