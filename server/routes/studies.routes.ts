import { z } from 'zod';
import { labParamsSchema } from '@shared/schemas/members';
import {
  createStudySchema,
  listStudiesQuerySchema,
  studyFormOptionsSchema,
  studyListSchema,
  studyParamsSchema,
  updateStudySchema,
} from '@shared/schemas/studies';
import { studyDetailSchema, studyHistorySchema } from '@shared/schemas/study-detail';
import { fitListSchema, runFitSchema, studyFitSchema } from '@shared/schemas/study-fits';
import { replacePointsSchema } from '@shared/schemas/study-points';
import { defineRoute } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { labOf, signedInActor } from '../http/request-context';
import { exportFitCsv, exportPointsCsv } from '../services/studies/study-export.service';
import { runFit } from '../services/studies/study-run-fit.service';
import { studyFormOptions } from '../services/studies/study-form-options.service';
import { listFits, studyHistory } from '../services/studies/study-history.service';
import { listStudies } from '../services/studies/study-list.service';
import { replacePoints } from '../services/studies/study-points.service';
import { createStudy, studyDetailAnswer, updateStudy } from '../services/studies/study.service';

const changeErrors = {
  400: { description: 'A field is invalid (details name each)' },
  403: { description: 'Not the owner of the study' },
  404: { description: 'No such study in this lab' },
  409: { description: 'Stale version, or the study is under review, approved (locked) or superseded' },
};

export const studyRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies',
    summary: 'Current study revisions of the lab: paginated, filtered, sorted, searched',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema, query: listStudiesQuerySchema },
    responses: { 200: { description: 'One page of studies with the total', schema: studyListSchema } },
    handler: async ({ req, res, query }) => {
      res.json(await listStudies(labOf(req), query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies',
    summary: 'Create a study (emitter and quencher picked, or named to be created in the library)',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: labParamsSchema, body: createStudySchema },
    responses: {
      201: { description: 'The new draft study', schema: studyDetailSchema },
      400: { description: 'Invalid fields' },
    },
    handler: async ({ req, res, body }) => {
      res.status(201).json(await createStudy(req.app.locals.services.sequelize, labOf(req), body, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/study-form-options',
    summary: 'Compounds, emitter lifetimes, solvents and members for the study form and list filters',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: labParamsSchema },
    responses: { 200: { description: 'Options', schema: studyFormOptionsSchema } },
    handler: async ({ req, res }) => {
      res.json(await studyFormOptions(labOf(req)));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId',
    summary: 'A study with its points (raw and corrected), newest fit, files and review thread',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'The study', schema: studyDetailSchema },
      404: { description: 'No such study in this lab' },
    },
    handler: async ({ req, res, params }) => {
      // The detail's JSON with its latest fit as PostgreSQL wrote it (studyDetailAnswer).
      res.type('json').send(await studyDetailAnswer(labOf(req), params.studyId));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/labs/:labId/studies/:studyId',
    summary: "Change a study's settings (owner; with the version edited); refits",
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema, body: updateStudySchema },
    responses: { 200: { description: 'The changed study', schema: studyDetailSchema }, ...changeErrors },
    handler: async ({ req, res, params, body }) => {
      res.json(
        await updateStudy(req.app.locals.services.sequelize, labOf(req), params.studyId, body, signedInActor(req)),
      );
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/api/labs/:labId/studies/:studyId/points',
    summary: 'Replace the series points (owner; with the version edited); refits',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema, body: replacePointsSchema },
    responses: {
      200: { description: 'The study with its new points and fit', schema: studyDetailSchema },
      ...changeErrors,
    },
    handler: async ({ req, res, params, body }) => {
      res.json(
        await replacePoints(req.app.locals.services.sequelize, labOf(req), params.studyId, body, signedInActor(req)),
      );
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/fits',
    summary: 'Every fit of the study, newest first',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'Fits', schema: fitListSchema },
      404: { description: 'No such study in this lab' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await listFits(labOf(req), params.studyId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/fits',
    summary: "Fit now with a chosen model and weighting (owner); stored as a new fit and made the study's",
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema, body: runFitSchema },
    responses: {
      201: { description: 'The new fit', schema: studyFitSchema },
      ...changeErrors,
      422: { description: 'The series cannot be fitted with this model' },
    },
    handler: async ({ req, res, params, body }) => {
      res
        .status(201)
        .json(await runFit(req.app.locals.services.sequelize, labOf(req), params.studyId, body, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/history',
    summary: 'Audit trail of the study with before and after values',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'Events, newest first', schema: studyHistorySchema },
      404: { description: 'No such study in this lab' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await studyHistory(labOf(req), params.studyId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/export.csv',
    summary: 'CSV of the points (part=points) or of the newest fit (part=fit); formula-like cells neutralised',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema, query: z.object({ part: z.enum(['points', 'fit']).default('points') }) },
    responses: { 200: { description: 'text/csv' }, 404: { description: 'No such study in this lab' } },
    handler: async ({ req, res, params, query }) => {
      const file =
        query.part === 'fit'
          ? await exportFitCsv(labOf(req), params.studyId)
          : await exportPointsCsv(labOf(req), params.studyId);
      sendDownload(res, { fileName: file.fileName, type: 'text/csv', body: file.body });
    },
  }),
];
