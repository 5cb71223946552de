import type { Request, Response } from 'express';
import {
  absorptionOptionsSchema,
  absorptionPreviewSchema,
  absorptionReanalysisSchema,
  absorptionTitrationListSchema,
  absorptionTitrationParamsSchema,
  absorptionTitrationReanalysedSchema,
  absorptionTitrationSchema,
} from '@shared/schemas/absorption-titrations';
import { spectraDiscardedSchema } from '@shared/schemas/spectrum-matrices';
import { studyParamsSchema } from '@shared/schemas/studies';
import { defineRoute, parsePart } from '../http/define-route';
import { filesReceiver } from '../http/receive-files';
import { labOf, signedInActor } from '../http/request-context';
import {
  discardAbsorptionTitration,
  reanalyseAbsorptionTitration,
} from '../services/mechanism/absorption-titration-changes.service';
import {
  keepAbsorptionTitration,
  listAbsorptionTitrations,
  previewAbsorptionTitration,
  type AbsorptionUpload,
} from '../services/mechanism/absorption-titrations.service';

const receiveSpectra = filesReceiver({ what: 'the spectra', second: 'quencher', fields: 3, fieldSize: 1024 });

const FIELDS =
  'multipart fields: "file" (UV-vis spectra of the emitter: wavelength in nm in the first column, one absorbance spectrum per column with its [Q] in the header, a blank at 0 and 3 or more concentrations above it, all on one grid; or JCAMP-DX), optional "quencher" (the quencher alone on the same grid: wavelength and one column, headed with its concentration for a spectrum or starting "ε"/"epsilon" for ε in M^-1 cm^-1), optional "bandWidth" (nm, default 5, 0 for one band per wavelength), "pathLength" (cm, default 1), "emitterConcentration" (mol/L, for the exact isotherm); 20 MB per file';

/** The spectra, the quencher's spectrum if sent, and the options (400 naming the field). */
async function receiveTitration(req: Request, res: Response): Promise<AbsorptionUpload> {
  const { file, second, fields } = await receiveSpectra(req, res);
  return { file, quencher: second, options: parsePart(absorptionOptionsSchema, fields, 'body') };
}

const readResponses = {
  400: {
    description: 'No file, or options that are not valid (a path length of 0 or less...: details name the field)',
  },
  404: { description: 'No such study' },
  413: { description: 'Larger than 20 MB or over a reading limit; nothing kept' },
  415: { description: 'Not an accepted file type' },
  422: {
    description:
      "Unreadable (a spectrum without a concentration in its header, spectra or the quencher's spectrum on another wavelength grid, a bad cell: details name it), no blank or fewer than 3 concentrations above 0; nothing kept",
  },
  503: { description: 'Too many files are being read; send them again shortly' },
};

export const absorptionTitrationRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/absorption-titrations/preview',
    summary: `Read and analyse UV-vis spectra of the emitter with increasing quencher and answer what was found; keeps nothing (${FIELDS})`,
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      200: {
        description:
          'The file as read, the difference spectra, the change flag, K_a both ways and the comparison with K_S',
        schema: absorptionPreviewSchema,
      },
      ...readResponses,
    },
    handler: async ({ req, res, params }) => {
      const upload = await receiveTitration(req, res);
      res.json(await previewAbsorptionTitration(req.app.locals.services, labOf(req), params.studyId, upload));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/absorption-titrations',
    summary: `Keep an absorption titration with the study, analysed as in the preview (${FIELDS})`,
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: studyParamsSchema },
    responses: {
      201: { description: 'The kept titration with its analysis', schema: absorptionTitrationSchema },
      ...readResponses,
      403: { description: 'Not the owner' },
      409: { description: 'The study is locked' },
    },
    handler: async ({ req, res, params }) => {
      const upload = await receiveTitration(req, res);
      res
        .status(201)
        .json(
          await keepAbsorptionTitration(
            req.app.locals.services,
            labOf(req),
            params.studyId,
            upload,
            signedInActor(req),
          ),
        );
    },
  }),
  defineRoute({
    method: 'get',
    path: '/api/labs/:labId/studies/:studyId/absorption-titrations',
    summary: "A study's absorption titrations, newest first, each with K_a compared with the study's current K_S",
    tags: ['mechanism'],
    access: { lab: 'viewer' },
    request: { params: studyParamsSchema },
    responses: {
      200: { description: 'The titrations', schema: absorptionTitrationListSchema },
      404: { description: 'No such study' },
    },
    handler: async ({ req, res, params }) => {
      res.json({ items: await listAbsorptionTitrations(labOf(req), params.studyId) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId/reanalyse',
    summary:
      "Analyse a kept absorption titration again from its kept files with new settings (band width, path length, [E]0, whether the quencher's own absorbance is taken out, which K_a the verdict uses); audited with the verdict before and after",
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: absorptionTitrationParamsSchema, body: absorptionReanalysisSchema },
    responses: {
      200: {
        description: "The titration as now analysed, and the study's mechanism verdict before and after",
        schema: absorptionTitrationReanalysedSchema,
      },
      400: { description: 'Settings that are not valid (details name the field)' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study or titration' },
      409: { description: 'The study is locked' },
      422: {
        description:
          "The quencher's absorbance asked to be taken out of a titration kept without its file, or the analysis cannot be done at these settings; nothing changed",
      },
      503: { description: 'Too many files are being read, or the object store did not answer; nothing changed' },
    },
    handler: async ({ req, res, params, body }) => {
      res.json(
        await reanalyseAbsorptionTitration(
          req.app.locals.services,
          labOf(req),
          params.studyId,
          params.titrationId,
          body,
          signedInActor(req),
        ),
      );
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId',
    summary:
      'Discard a kept absorption titration and its files (a file another revision still names stays; the audit log keeps their names, SHA-256 and the verdict before and after)',
    tags: ['mechanism'],
    access: { lab: 'researcher' },
    request: { params: absorptionTitrationParamsSchema },
    responses: {
      200: { description: "Discarded; the study's mechanism verdict before and after", schema: spectraDiscardedSchema },
      400: { description: 'Not a titration id' },
      403: { description: 'Not the owner' },
      404: { description: 'No such study or titration' },
      409: { description: 'The study is locked' },
    },
    handler: async ({ req, res, params }) => {
      res.json(
        await discardAbsorptionTitration(
          req.app.locals.services,
          labOf(req),
          params.studyId,
          params.titrationId,
          signedInActor(req),
        ),
      );
    },
  }),
];
