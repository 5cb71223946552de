import { drivingForceQuerySchema, drivingForceSchema } from '@shared/schemas/driving-force';
import { labSettingsUpdateSchema } from '@shared/schemas/lab-settings';
import { measurementParamsSchema } from '@shared/schemas/library-measurements';
import { labSettingsSchema, lifetimeDependentsSchema } from '@shared/schemas/library-views';
import { labParamsSchema } from '@shared/schemas/members';
import { defineRoute } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import { drivingForce } from '../services/library/driving-force.service';
import { getLabSettings, updateLabSettings } from '../services/library/lab-settings.service';
import { lifetimeDependents } from '../services/library/lifetime-dependents.service';

export const librarySettingsRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/settings',
    summary: 'The reference electrode and solvent in which the lab reads potentials',
    tags: ['library'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'Settings', schema: labSettingsSchema } },
    handler: async ({ req, res }) => {
      res.json(await getLabSettings(labOf(req)));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/labs/:labId/settings',
    summary: 'Change the display reference electrode or solvent (admins); stored potentials keep their own reference',
    tags: ['library'],
    access: { lab: 'admin' },
    request: { params: labParamsSchema, body: labSettingsUpdateSchema },
    responses: {
      200: { description: 'Changed', schema: labSettingsSchema },
      400: { description: 'Unknown reference or solvent' },
    },
    handler: async ({ req, res, body }) => {
      res.json(await updateLabSettings(req.app.locals.services.sequelize, labOf(req), signedInActor(req), body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/driving-force',
    summary:
      'Electron-transfer driving force of an emitter–quencher pair, both pathways, Coulomb term apart, energy transfer, and what is missing',
    tags: ['library'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, query: drivingForceQuerySchema },
    responses: {
      200: {
        description: 'Driving force (eV and kJ/mol), potentials in the lab’s display reference',
        schema: drivingForceSchema,
      },
      400: { description: 'Bad ids or an unknown solvent' },
      404: { description: 'A compound is not in this lab' },
    },
    handler: async ({ req, res, query }) => {
      res.json(await drivingForce(labOf(req), query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/compounds/:compoundId/lifetimes/:lifetimeId/dependents',
    summary: 'Current studies whose tau0 comes from this lifetime record, to choose which to refit',
    tags: ['library'],
    access: { lab: 'viewer' },
    request: { params: measurementParamsSchema('lifetimeId') },
    responses: {
      200: { description: 'Studies using the record', schema: lifetimeDependentsSchema },
      404: { description: 'No such lifetime' },
    },
    handler: async ({ req, res, params }) => {
      const { compoundId, lifetimeId } = params as Record<string, string>;
      res.json(await lifetimeDependents(req.app.locals.services.sequelize, labOf(req), compoundId!, lifetimeId!));
    },
  }),
];
