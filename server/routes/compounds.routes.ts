import { labParamsSchema } from '@shared/schemas/members';
import {
  compoundInputSchema,
  compoundListQuerySchema,
  compoundListSchema,
  compoundParamsSchema,
  compoundUpdateSchema,
  versionQuerySchema,
} from '@shared/schemas/library';
import { importReportSchema, libraryImportSchema } from '@shared/schemas/library-import';
import { compoundDetailSchema } from '@shared/schemas/library-views';
import { defineRoute } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { labOf, signedInActor } from '../http/request-context';
import {
  createCompound,
  deleteCompound,
  getCompound,
  listCompounds,
  updateCompound,
} from '../services/library/compounds.service';
import { exportLibraryCsv } from '../services/library/library-export.service';
import { importLibraryCsv } from '../services/library/library-import.service';

const tags = ['library'];

export const compoundRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/compounds',
    summary: 'The lab’s compound library, by name, paginated, with search and a role filter',
    tags,
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, query: compoundListQuerySchema },
    responses: { 200: { description: 'One page of compounds with the total', schema: compoundListSchema } },
    handler: async ({ req, res, query }) => {
      res.json(await listCompounds(labOf(req), query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/compounds',
    summary: 'Add a compound to the library',
    tags,
    access: { lab: 'researcher' },
    request: { params: labParamsSchema, body: compoundInputSchema },
    responses: {
      201: { description: 'Added', schema: compoundDetailSchema },
      400: { description: 'A field is invalid' },
      409: { description: 'The name is already used in this lab' },
    },
    handler: async ({ req, res, body }) => {
      res
        .status(201)
        .json(await createCompound(req.app.locals.services.sequelize, labOf(req), signedInActor(req), body));
    },
  }),
  // Declared before /compounds/:compoundId so "export.csv" is never read as a compound id.
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/compounds/export.csv',
    summary: 'The whole library as CSV (the import format); cells that start with = + - @ are neutralised',
    tags,
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'text/csv, one row per compound, potential, lifetime or E00' } },
    handler: async ({ req, res }) => {
      sendDownload(res, {
        fileName: 'halflight-library.csv',
        type: 'text/csv; charset=utf-8',
        body: await exportLibraryCsv(labOf(req)),
      });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/compounds/import',
    summary: 'Import library CSV, all or nothing; dryRun only reports the problems by row and column',
    tags,
    access: { lab: 'researcher' },
    request: { params: labParamsSchema, body: libraryImportSchema },
    responses: {
      200: { description: 'Dry run: what would be saved and every problem', schema: importReportSchema },
      201: { description: 'Everything saved', schema: importReportSchema },
      400: { description: 'Nothing saved; details name each row and column (path csv.row<n>.<column>)' },
    },
    handler: async ({ req, res, body }) => {
      const report = await importLibraryCsv(
        req.app.locals.services.sequelize,
        labOf(req),
        signedInActor(req),
        body.csv,
        body.dryRun ?? false,
      );
      res.status(report.saved ? 201 : 200).json(report);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/compounds/:compoundId',
    summary:
      'One compound with its potentials (in the display reference, original beside), lifetimes, E00 and excited-state potentials',
    tags,
    access: { lab: 'viewer' },
    request: { params: compoundParamsSchema },
    responses: {
      200: { description: 'The compound', schema: compoundDetailSchema },
      404: { description: 'Not in this lab' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await getCompound(labOf(req), params.compoundId));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/labs/:labId/compounds/:compoundId',
    summary: 'Change a compound (researchers their own; reviewers and admins any); send the version you read',
    tags,
    access: { lab: 'researcher' },
    request: { params: compoundParamsSchema, body: compoundUpdateSchema },
    responses: {
      200: { description: 'Changed', schema: compoundDetailSchema },
      403: { description: 'Not yours to change' },
      404: { description: 'Not in this lab' },
      409: { description: 'stale_version, or the name is taken' },
    },
    handler: async ({ req, res, params, body }) => {
      res.json(
        await updateCompound(
          req.app.locals.services.sequelize,
          labOf(req),
          signedInActor(req),
          params.compoundId,
          body,
        ),
      );
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/compounds/:compoundId',
    summary: 'Remove a compound and its measurements (reviewers and admins)',
    tags,
    access: { lab: 'reviewer' },
    request: { params: compoundParamsSchema, query: versionQuerySchema },
    responses: {
      204: { description: 'Removed' },
      404: { description: 'Not in this lab' },
      409: { description: 'stale_version, or studies use it' },
    },
    handler: async ({ req, res, params, query }) => {
      await deleteCompound(
        req.app.locals.services.sequelize,
        labOf(req),
        signedInActor(req),
        params.compoundId,
        query.version,
      );
      res.status(204).end();
    },
  }),
];
