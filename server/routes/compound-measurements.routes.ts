import type { z } from 'zod';
import { compoundParamsSchema, versionQuerySchema } from '@shared/schemas/library';
import {
  energyInputSchema,
  energySchema,
  energyUpdateSchema,
  lifetimeInputSchema,
  lifetimeSchema,
  lifetimeUpdateSchema,
  measurementParamsSchema,
  potentialInputSchema,
  potentialSchema,
  potentialUpdateSchema,
} from '@shared/schemas/library-measurements';
import { defineRoute } from '../http/define-route';
import type { AnyRouteSpec } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import {
  addEnergy,
  addLifetime,
  addPotential,
  changeEnergy,
  changeLifetime,
  changePotential,
  removeMeasurement,
} from '../services/library/measurements.service';
import type { MeasurementKind } from '../services/library/measurement-store.service';

type Context = Parameters<typeof addPotential>[0];
type Ids = { compoundId: string; id: string };

interface Measurement {
  kind: MeasurementKind;
  segment: string;
  idName: 'potentialId' | 'lifetimeId' | 'energyId';
  words: string;
  input: z.ZodType;
  update: z.ZodType;
  output: z.ZodType;
  add: (context: Context, compoundId: string, input: never) => Promise<unknown>;
  change: (context: Context, ids: Ids, input: never) => Promise<unknown>;
}

const measurements: Measurement[] = [
  {
    kind: 'potential',
    segment: 'potentials',
    idName: 'potentialId',
    words: 'a ground-state redox potential (V, as reported, with its reference electrode)',
    input: potentialInputSchema,
    update: potentialUpdateSchema,
    output: potentialSchema,
    add: addPotential,
    change: changePotential,
  },
  {
    kind: 'lifetime',
    segment: 'lifetimes',
    idName: 'lifetimeId',
    words: 'an unquenched excited-state lifetime (s)',
    input: lifetimeInputSchema,
    update: lifetimeUpdateSchema,
    output: lifetimeSchema,
    add: addLifetime,
    change: changeLifetime,
  },
  {
    kind: 'energy',
    segment: 'energies',
    idName: 'energyId',
    words: 'an E00 (eV, or a wavelength in nm converted by the engine)',
    input: energyInputSchema,
    update: energyUpdateSchema,
    output: energySchema,
    add: addEnergy,
    change: changeEnergy,
  },
];

const contextOf = (req: Parameters<AnyRouteSpec['handler']>[0]['req']): Context => ({
  sequelize: req.app.locals.services.sequelize,
  lab: labOf(req),
  actor: signedInActor(req),
});

/** Add, change and remove for each kind of measurement: researchers add and change their own, reviewers curate. */
export const compoundMeasurementRoutes: AnyRouteSpec[] = measurements.flatMap((m) => {
  const base = `/api/labs/:labId/compounds/:compoundId/${m.segment}`;
  const params = measurementParamsSchema(m.idName);
  return [
    defineRoute({
      method: 'post',
      path: base,
      summary: `Add ${m.words}`,
      tags: ['library'],
      access: { lab: 'researcher' },
      request: { params: compoundParamsSchema, body: m.input },
      responses: {
        201: { description: 'Added', schema: m.output },
        400: { description: 'A field is invalid' },
        404: { description: 'No such compound' },
      },
      handler: async ({ req, res, params: { compoundId }, body }) => {
        res.status(201).json(await m.add(contextOf(req), compoundId, body as never));
      },
    }),
    defineRoute({
      method: 'patch',
      path: `${base}/:${m.idName}`,
      summary: `Change ${m.words}; send the version you read`,
      tags: ['library'],
      access: { lab: 'researcher' },
      request: { params, body: m.update },
      responses: {
        200: { description: 'Changed', schema: m.output },
        403: { description: 'Not yours to change' },
        404: { description: 'No such record' },
        409: { description: 'stale_version' },
      },
      handler: async ({ req, res, params: ids, body }) => {
        const record = ids as Record<string, string>;
        res.json(
          await m.change(contextOf(req), { compoundId: record.compoundId!, id: record[m.idName]! }, body as never),
        );
      },
    }),
    defineRoute({
      method: 'delete',
      path: `${base}/:${m.idName}`,
      summary: `Remove ${m.words} (reviewers and admins)`,
      tags: ['library'],
      access: { lab: 'reviewer' },
      request: { params, query: versionQuerySchema },
      responses: {
        204: { description: 'Removed' },
        404: { description: 'No such record' },
        409: { description: 'stale_version' },
      },
      handler: async ({ req, res, params: ids, query }) => {
        const record = ids as Record<string, string>;
        await removeMeasurement(
          contextOf(req),
          m.kind,
          { compoundId: record.compoundId!, id: record[m.idName]! },
          query.version,
        );
        res.status(204).end();
      },
    }),
  ];
});
