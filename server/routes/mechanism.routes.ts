import { labParamsSchema } from '@shared/schemas/members';
import { mechanismEvidenceSchema } from '@shared/schemas/mechanism-evidence';
import {
  temperatureSeriesAnalysisSchema,
  temperatureSeriesListSchema,
  temperatureSeriesQuerySchema,
} from '@shared/schemas/temperature-series';
import {
  mechanismFileParamsSchema,
  spectraDiscardedSchema,
  spectrumMatrixListSchema,
  spectrumMatrixOptionsSchema,
  spectrumMatrixParamsSchema,
  spectrumMatrixReanalysedSchema,
  spectrumMatrixReanalysisSchema,
  spectrumMatrixSchema,
} from '@shared/schemas/spectrum-matrices';
import { studyParamsSchema } from '@shared/schemas/studies';
import { receiveAcceptedFile } from '../http/receive-files';
import { defineRoute, parsePart } from '../http/define-route';
import { labOf, signedInActor } from '../http/request-context';
import { sendDownload } from '../http/send-download';
import {
  downloadMechanismFile,
  keepSpectrumMatrix,
  listSpectrumMatrices,
} from '../services/mechanism/spectrum-matrices.service';
import { mechanismEvidence } from '../services/mechanism/mechanism-evidence.service';
import { discardSpectrumMatrix, reanalyseSpectrumMatrix } from '../services/mechanism/spectrum-matrix-changes.service';
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
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/mechanism',
    summary:
      "A study's mechanism evidence: lifetime against intensity, the temperature trend of its series, K_SV across the emission, absorption change and kq against the diffusion limit at its temperature, each with what it says and its numbers; the combined verdict with reasons; the missing pieces",
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'The evidence and the verdict', schema: mechanismEvidenceSchema },
      404: { description: 'No such study in this lab' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await mechanismEvidence(labOf(req), params.studyId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/spectrum-matrices',
    summary:
      'Keep emission spectra of the study at several [Q] (multipart "file": wavelength in nm in the first column, one spectrum per column with its concentration in the header, all on one grid; or JCAMP-DX; 20 MB; optional field "bandWidth" in nm, default 10, 0 for one band per wavelength) and analyse them: K_SV per band with SE, χ² homogeneity, spectral components, flags',
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      201: { description: 'The kept matrix with its analysis', schema: spectrumMatrixSchema },
      400: { description: 'No file, or a band width that is not valid (details name the field)' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study' },
      409: { description: 'The study is locked' },
      413: { description: 'Larger than 20 MB or over a reading limit; nothing kept' },
      415: { description: 'Not an accepted file type' },
      422: {
        description:
          'Unreadable (a spectrum without a concentration in its header, spectra on different wavelength grids, a bad cell: details name it), no blank or fewer than 3 concentrations; nothing kept',
      },
      503: { description: 'Too many files are being read; send it again shortly' },
    },
    handler: async ({ req, res, params }) => {
      const file = await receiveAcceptedFile(req, res);
      const options = parsePart(spectrumMatrixOptionsSchema, req.body ?? {}, 'body');
      res
        .status(201)
        .json(
          await keepSpectrumMatrix(
            req.app.locals.services,
            labOf(req),
            params.studyId,
            { file, options },
            signedInActor(req),
          ),
        );
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/spectrum-matrices',
    summary: "A study's spectrum matrices with their wavelength-resolved K_SV, newest first",
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'The matrices', schema: spectrumMatrixListSchema },
      404: { description: 'No such study' },
    },
    handler: async ({ req, res, params }) => {
      res.json({ items: await listSpectrumMatrices(labOf(req), params.studyId) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId/reanalyse',
    summary:
      'Analyse a kept spectrum matrix again from its kept file at another band width; audited with the verdict before and after',
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: spectrumMatrixParamsSchema, body: spectrumMatrixReanalysisSchema },
    responses: {
      200: {
        description: "The matrix as now analysed, and the study's mechanism verdict before and after",
        schema: spectrumMatrixReanalysedSchema,
      },
      400: { description: 'A band width that is not valid (details name the field)' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study or matrix' },
      409: { description: 'The study is locked' },
      422: { description: 'The analysis cannot be done at this band width; nothing changed' },
      503: { description: 'Too many files are being read, or the object store did not answer; nothing changed' },
    },
    handler: async ({ req, res, params, body }) => {
      res.json(
        await reanalyseSpectrumMatrix(
          req.app.locals.services,
          labOf(req),
          params.studyId,
          params.matrixId,
          body,
          signedInActor(req),
        ),
      );
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId',
    summary:
      'Discard a kept spectrum matrix and its file (a file another revision still names stays; the audit log keeps its name, SHA-256 and the verdict before and after)',
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: spectrumMatrixParamsSchema },
    responses: {
      200: { description: "Discarded; the study's mechanism verdict before and after", schema: spectraDiscardedSchema },
      400: { description: 'Not a matrix id' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study or matrix' },
      409: { description: 'The study is locked' },
    },
    handler: async ({ req, res, params }) => {
      res.json(
        await discardSpectrumMatrix(
          req.app.locals.services,
          labOf(req),
          params.studyId,
          params.matrixId,
          signedInActor(req),
        ),
      );
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/mechanism-files/:fileId',
    summary: 'Download a kept mechanism file (a spectrum matrix) exactly as received',
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: mechanismFileParamsSchema },
    responses: {
      200: { description: 'The bytes' },
      404: { description: 'No such file' },
      503: { description: 'The object store holding the file did not answer' },
    },
    handler: async ({ req, res, params }) => {
      const file = await downloadMechanismFile(req.app.locals.services, labOf(req), params.fileId);
      sendDownload(res, { fileName: file.fileName, type: 'application/octet-stream', body: file.content });
    },
  }),
];
