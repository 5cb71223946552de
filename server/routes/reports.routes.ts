import { z } from 'zod';
import type { Response } from 'express';
import { comparisonParamsSchema, comparisonQuerySchema } from '@shared/schemas/comparisons';
import { scenarioParamsSchema } from '@shared/schemas/scenarios';
import { defineRoute } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { labOf } from '../http/request-context';
import { studyReport } from '../services/reports/study-report';
import { comparisonReport, scenarioReport } from '../services/reports/summary-reports';

const studyParams = z.object({
  labId: z.string().uuid('must be a lab id'),
  studyId: z.string().uuid('must be a study id'),
});
const sendPdf = (res: Response, { pdf, filename }: { pdf: Buffer; filename: string }) =>
  sendDownload(res, { fileName: filename, type: 'application/pdf', body: pdf });

export const reportRoutes = [
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/report.pdf',
    summary: 'PDF report of one study (conditions, points, plots, fit, flags, driving force, review, raw files)',
    tags: ['reports'],
    access: { lab: 'viewer' },
    request: { params: studyParams },
    responses: { 200: { description: 'application/pdf' }, 404: { description: 'No such study' } },
    handler: async ({ req, res, params }) => {
      sendPdf(res, await studyReport(req.app.locals.services, labOf(req), params.studyId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/scenarios/:scenarioId/report.pdf',
    summary: 'PDF summary of a reaction scenario',
    tags: ['reports'],
    access: { lab: 'viewer' },
    request: { params: scenarioParamsSchema },
    responses: { 200: { description: 'application/pdf' }, 404: { description: 'No such scenario' } },
    handler: async ({ req, res, params }) => {
      sendPdf(res, await scenarioReport(labOf(req), params.scenarioId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/comparisons/:side/:compoundId/report.pdf',
    summary: 'PDF summary of a comparison',
    tags: ['reports'],
    access: { lab: 'viewer' },
    request: { params: comparisonParamsSchema, query: comparisonQuerySchema },
    responses: { 200: { description: 'application/pdf' }, 404: { description: 'No such compound' } },
    handler: async ({ req, res, params, query }) => {
      sendPdf(res, await comparisonReport(labOf(req), params.side, params.compoundId, query.approvedOnly));
    },
  }),
];
