import type { Request, Response } from 'express';
import type { z } from 'zod';
import {
  applyDecaySetSchema,
  compoundDecayParamsSchema,
  libraryDecayOptionsSchema,
  studyDecaySetParamsSchema,
  type DecayReadOptions,
  decayCurveParamsSchema,
  decayCurvesSchema,
  decayFileParamsSchema,
  decayPreviewSchema,
  decayReadOptionsSchema,
  decaySetListSchema,
  decaySetParamsSchema,
  decaySetRefitSchema,
  decaySetSchema,
  refitDecaySetSchema,
} from '@shared/schemas/decays';
import { studyParamsSchema } from '@shared/schemas/studies';
import { studyDetailSchema } from '@shared/schemas/study-detail';
import { defineRoute, parsePart } from '../http/define-route';
import { sendDownload } from '../http/send-download';
import { filesReceiver, jsonField } from '../http/receive-files';
import { labOf, signedInActor } from '../http/request-context';
import {
  decaySetCurves,
  downloadDecayFile,
  keepLibraryDecay,
  keepStudyDecaySet,
  listCompoundDecaySets,
  listStudyDecaySets,
  previewDecaySet,
  previewLibraryDecay,
  type DecayUpload,
} from '../services/decays/decay-sets.service';
import { applyDecaySet } from '../services/decays/apply-decay-set.service';
import { refitDecaySet } from '../services/decays/refit-decay-set.service';
import { getStudyDetail } from '../services/studies/study.service';

const receiveDecayFiles = filesReceiver({ what: 'the decays', second: 'response', fields: 2, fieldSize: 64 * 1024 });

const FIELDS =
  'multipart fields: "file" (the decays: time in the first column with its unit in the header, one counts column per decay, concentrations in the headers, a response column named IRF or response; or JCAMP-DX on a time axis), optional "response" (the instrument response as its own file), optional "options" (JSON, DecayReadOptions); 20 MB per file';

/** The decay file (and response file) and the options as JSON that the schema accepts (400 naming the field). */
async function receiveDecays<O extends DecayReadOptions = DecayReadOptions>(
  req: Request,
  res: Response,
  schema: z.ZodType<O> = decayReadOptionsSchema as unknown as z.ZodType<O>,
): Promise<Omit<DecayUpload, 'options'> & { options: O }> {
  const { file, second, fields } = await receiveDecayFiles(req, res);
  const options = jsonField(fields, 'options') ?? {};
  return { file, response: second, options: parsePart(schema, options, 'body.options') };
}

const readResponses = {
  400: { description: 'No file, or options that are not valid (details name the field)' },
  404: { description: 'No such study' },
  413: { description: 'Larger than 20 MB or over a reading limit; nothing kept' },
  415: { description: 'Not an accepted file type' },
  422: {
    description:
      'Unreadable (time not increasing, a negative count, a bad cell: details name it), a decay that cannot be fitted, or a choice still open; nothing kept',
  },
  503: { description: 'Too many files are being read; send them again shortly' },
};

export const decaySetRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/decay-sets/preview',
    summary: `Read and fit decay histograms as chosen, and answer what was found; keeps nothing (${FIELDS})`,
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'The file as read, each decay fitted, the curves of one', schema: decayPreviewSchema },
      ...readResponses,
    },
    handler: async ({ req, res, params }) => {
      const upload = await receiveDecays(req, res);
      res.json(await previewDecaySet(req.app.locals.services, labOf(req), params.studyId, upload));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/decay-sets',
    summary: `Keep a decay set in a study: the raw files byte for byte with their SHA-256 and every decay's fit (${FIELDS})`,
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      201: { description: 'The kept set', schema: decaySetSchema },
      ...readResponses,
      403: { description: 'Not the owner' },
      409: { description: 'The study is locked' },
    },
    handler: async ({ req, res, params }) => {
      const upload = await receiveDecays(req, res);
      res
        .status(201)
        .json(await keepStudyDecaySet(req.app.locals.services, labOf(req), params.studyId, upload, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/decay-sets',
    summary: "A study's decay sets, newest first",
    tags: ['decays'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: { 200: { description: 'The sets', schema: decaySetListSchema }, 404: { description: 'No such study' } },
    handler: async ({ req, res, params }) => {
      res.json({ items: await listStudyDecaySets(labOf(req), params.studyId) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/decay-sets/:setId/decays/:index/curves',
    summary:
      'One decay of a kept set for plotting: counts, response, fitted curve, weighted residuals and their autocorrelation',
    tags: ['decays'],
    access: { lab: 'viewer' },
    request: { params: decayCurveParamsSchema },
    responses: {
      200: { description: 'The curves (time in s)', schema: decayCurvesSchema },
      404: { description: 'No such set or decay' },
    },
    handler: async ({ req, res, params }) => {
      res.json(await decaySetCurves(req.app.locals.services, labOf(req), params.setId, params.index));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/decay-files/:fileId',
    summary: 'Download a decay file (or response file) exactly as received',
    tags: ['decays'],
    access: { lab: 'viewer' },
    request: { params: decayFileParamsSchema },
    responses: {
      200: { description: 'The bytes' },
      404: { description: 'No such file' },
      503: { description: 'The object store holding the file did not answer' },
    },
    handler: async ({ req, res, params }) => {
      const file = await downloadDecayFile(req.app.locals.services, labOf(req), params.fileId);
      sendDownload(res, { fileName: file.fileName, type: 'application/octet-stream', body: file.content });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/decay-sets/:setId/apply',
    summary:
      "Put a kept decay set's lifetimes into the study: each decay fills the lifetime (with its SE, labelled from decay <file>) of a point at its concentration or adds one; the zero-concentration decays give tau0",
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: studyDecaySetParamsSchema, body: applyDecaySetSchema },
    responses: {
      200: { description: 'The study with its new lifetimes, tau0 and fit', schema: studyDetailSchema },
      403: { description: 'Not the owner' },
      404: { description: 'No such study or decay set' },
      409: { description: 'Stale version or locked study' },
      422: { description: 'A decay has no concentration; nothing saved' },
    },
    handler: async ({ req, res, params, body }) => {
      const lab = labOf(req);
      await applyDecaySet(
        req.app.locals.services.sequelize,
        lab,
        params.studyId,
        params.setId,
        body,
        signedInActor(req),
      );
      res.json(await getStudyDetail(lab, params.studyId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/decay-sets/:setId/refit',
    summary:
      "Fit a kept decay set again with another model (exponentials, tail or reconvolution, estimator, start channel) from its kept files; the study's lifetimes and tau0 that came from it and the library lifetime record it feeds take the new values, each change in the history",
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: decaySetParamsSchema, body: refitDecaySetSchema },
    responses: {
      200: { description: 'The refitted set and what else changed', schema: decaySetRefitSchema },
      403: { description: "Not the study's owner, or not the person who kept a library set (nor a reviewer or admin)" },
      404: { description: 'No such decay set' },
      409: { description: 'Stale set version, or the study is locked' },
      422: { description: 'A decay cannot be fitted with this model; nothing changed' },
      503: { description: 'The object store holding the files did not answer' },
    },
    handler: async ({ req, res, params, body }) => {
      res.json(await refitDecaySet(req.app.locals.services, labOf(req), params.setId, body, signedInActor(req)));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/compounds/:compoundId/decay-lifetimes/preview',
    summary: `Read and fit one decay of an emitter as chosen, before it becomes a library lifetime; keeps nothing (${FIELDS})`,
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: compoundDecayParamsSchema },
    responses: {
      200: {
        description: 'The file as read and its decay fitted; a file with other than one decay gets a question',
        schema: decayPreviewSchema,
      },
      ...readResponses,
      404: { description: 'No such compound' },
    },
    handler: async ({ req, res, params }) => {
      const upload = await receiveDecays(req, res);
      res.json(await previewLibraryDecay(req.app.locals.services, labOf(req), params.compoundId, upload));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/compounds/:compoundId/decay-sets',
    summary: "A compound's decay sets, newest first: each the decay a library lifetime record was fitted from",
    tags: ['decays'],
    access: { lab: 'viewer' },
    request: { params: compoundDecayParamsSchema },
    responses: {
      200: { description: 'The sets', schema: decaySetListSchema },
      404: { description: 'No such compound' },
    },
    handler: async ({ req, res, params }) => {
      res.json({ items: await listCompoundDecaySets(labOf(req), params.compoundId) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/compounds/:compoundId/decay-lifetimes',
    summary: `Keep one decay of an emitter and add its lifetime to the library, with the file as its source (${FIELDS}; options also carry solvent, atmosphere, temperature and notes)`,
    tags: ['decays'],
    access: { lab: 'researcher' },
    request: { params: compoundDecayParamsSchema },
    responses: {
      201: { description: 'The kept set; lifetimeId names the new lifetime record', schema: decaySetSchema },
      ...readResponses,
      404: { description: 'No such compound' },
    },
    handler: async ({ req, res, params }) => {
      const { options, ...files } = await receiveDecays(req, res, libraryDecayOptionsSchema);
      const { solvent, atmosphere, temperature, notes, ...readOptions } = options;
      res
        .status(201)
        .json(
          await keepLibraryDecay(
            req.app.locals.services,
            labOf(req),
            params.compoundId,
            { ...files, options: readOptions, conditions: { solvent, atmosphere, temperature, notes } },
            signedInActor(req),
          ),
        );
    },
  }),
];
