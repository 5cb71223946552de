import { labParamsSchema, paginationQuerySchema } from '@shared/schemas/members';
import {
  scenarioInputSchema,
  scenarioListSchema,
  scenarioParamsSchema,
  scenarioSchema,
} from '@shared/schemas/scenarios';
import { defineRoute } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import {
  createScenario,
  deleteScenario,
  getScenario,
  listScenarios,
  updateScenario,
} from '../services/scenarios/scenario.service';

const badInput = { description: 'Missing or negative concentration, unknown compound or study' };

export const scenarioRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/scenarios',
    summary: 'Reaction scenarios of the lab, newest first',
    tags: ['scenarios'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, query: paginationQuerySchema },
    responses: { 200: { description: 'Scenarios', schema: scenarioListSchema } },
    handler: async ({ req, res, query }) => {
      res.json(await listScenarios(labOf(req), query.page, query.pageSize));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/scenarios',
    summary: "Save a reaction scenario; the answer holds each component's share of the excited emitter",
    tags: ['scenarios'],
    access: { lab: 'researcher' },
    request: { params: labParamsSchema, body: scenarioInputSchema },
    responses: { 201: { description: 'Saved and evaluated', schema: scenarioSchema }, 400: badInput },
    handler: async ({ req, res, body }) => {
      const { sequelize } = req.app.locals.services;
      res.status(201).json(await createScenario(sequelize, labOf(req), signedInActor(req), body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/scenarios/:scenarioId',
    summary: "One scenario with kq per component (from the lab's studies) and the fractions intercepted",
    tags: ['scenarios'],
    access: { lab: 'viewer' },
    request: { params: scenarioParamsSchema },
    responses: {
      200: { description: 'Evaluated scenario', schema: scenarioSchema },
      404: { description: 'No such scenario' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await getScenario(labOf(req), params.scenarioId));
    },
  }),
  defineRoute({
    method: 'put',
    path: '/api/labs/:labId/scenarios/:scenarioId',
    summary: 'Replace a scenario (its maker, reviewers and admins); send the version you edited',
    tags: ['scenarios'],
    access: { lab: 'researcher' },
    request: { params: scenarioParamsSchema, body: scenarioInputSchema },
    responses: {
      200: { description: 'Saved and evaluated', schema: scenarioSchema },
      400: badInput,
      403: { description: 'Not your scenario' },
      404: { description: 'No such scenario' },
      409: { description: 'Changed by someone else since you opened it' },
    },
    handler: async ({ req, res, params, body }) => {
      const { sequelize } = req.app.locals.services;
      res.json(await updateScenario(sequelize, labOf(req), signedInActor(req), params.scenarioId, body));
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/scenarios/:scenarioId',
    summary: 'Delete a scenario (its maker, reviewers and admins)',
    tags: ['scenarios'],
    access: { lab: 'researcher' },
    request: { params: scenarioParamsSchema },
    responses: {
      204: { description: 'Deleted' },
      403: { description: 'Not your scenario' },
      404: { description: 'No such scenario' },
    },
    handler: async ({ req, res, params }) => {
      await deleteScenario(req.app.locals.services.sequelize, labOf(req), signedInActor(req), params.scenarioId);
      res.status(204).end();
    },
  }),
];
