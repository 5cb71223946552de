import { studyParamsSchema } from '@shared/schemas/studies';
import {
  applyUploadSchema,
  previewUploadSchema,
  uploadParamsSchema,
  uploadPreviewSchema,
} from '@shared/schemas/study-uploads';
import { studyDetailSchema } from '@shared/schemas/study-detail';
import { defineRoute } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { receiveAcceptedFile } from '../http/receive-files';
import { labOf, signedInActor } from '../http/request-context';
import { applyUpload, downloadUpload, previewUpload, receiveUpload } from '../services/studies/study-upload.service';
import { getStudyDetail } from '../services/studies/study.service';

export const studyUploadRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/uploads',
    summary:
      'Upload a raw file (multipart field "file"; .csv .tsv .txt .dat .asc .xlsx, JCAMP-DX .jdx .dx; 20 MB). Kept as received; answers a preview, saves no points',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      201: {
        description: 'Parsed: the table, a proposed mapping and the points it gives',
        schema: uploadPreviewSchema,
      },
      400: { description: 'No file' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study' },
      409: { description: 'The same bytes were uploaded to this study before, or the study is locked' },
      413: {
        description:
          'Larger than 20 MB (nothing kept), or over a reading limit (rows, columns, cells, line length, points, unpacked size; kept as failed)',
      },
      415: { description: 'Not an accepted file type' },
      422: { description: 'Kept but unreadable (details name row and column), or reading ran over its time limit' },
      503: { description: 'Too many files are being read; nothing kept, send it again shortly' },
    },
    handler: async ({ req, res, params }) => {
      const file = await receiveAcceptedFile(req, res);
      const lab = labOf(req);
      res.status(201).json(await receiveUpload(req.app.locals.services, lab, params.studyId, file, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/uploads/:uploadId/preview',
    summary: 'Read a kept upload again with another mapping (columns, units, spectrum window); saves nothing',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: uploadParamsSchema, body: previewUploadSchema },
    responses: {
      200: { description: 'Preview; problems name row and column', schema: uploadPreviewSchema },
      404: { description: 'No such upload' },
      413: { description: 'This mapping goes over a reading limit (for instance the points of one series)' },
    },
    handler: async ({ req, res, params, body }) => {
      res.json(await previewUpload(req.app.locals.services, labOf(req), params.studyId, params.uploadId, body.mapping));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/uploads/:uploadId/apply',
    summary: "Confirm a mapping: the upload's points replace (or extend) the series when they can be fitted",
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: uploadParamsSchema, body: applyUploadSchema },
    responses: {
      200: { description: 'The study with the new series and fit', schema: studyDetailSchema },
      403: { description: 'Not the owner' },
      404: { description: 'No such upload' },
      409: { description: 'Stale version or locked study' },
      422: { description: 'Unreadable cells or a series that cannot be fitted; nothing saved' },
    },
    handler: async ({ req, res, params, body }) => {
      const lab = labOf(req);
      await applyUpload(req.app.locals.services, lab, params.studyId, params.uploadId, body, signedInActor(req));
      res.json(await getStudyDetail(lab, params.studyId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/uploads/:uploadId/file',
    summary: 'Download a raw upload exactly as received',
    tags: ['studies'],
    access: { lab: 'viewer' },
    request: { params: uploadParamsSchema },
    responses: {
      200: { description: 'The bytes' },
      404: { description: 'No such upload' },
      503: { description: 'The object store holding the file did not answer' },
    },
    handler: async ({ req, res, params }) => {
      const file = await downloadUpload(req.app.locals.services.files, labOf(req), params.studyId, params.uploadId);
      sendDownload(res, { fileName: file.fileName, type: 'application/octet-stream', body: file.content });
    },
  }),
];
