import { fileReadingFieldsSchema, fileReadingSchema, fileReadingMappingSchema } from '@shared/schemas/file-reading';
import { labParamsSchema } from '@shared/schemas/members';
import { jsonField, receiveAcceptedFile } from '../http/receive-files';
import { defineRoute } from '../http/define-route';
import { AppError } from '../lib/app-error';
import { readFileForPreview } from '../services/studies/read-file.service';

export const fileReadingRoutes = [
  defineRoute({
    method: 'post',
    path: '/api/labs/:labId/file-readings',
    summary:
      'Read an instrument export without keeping it (multipart field "file"; optional fields "mapping" as JSON, and the new study\'s "windowStart", "windowEnd" or "emissionWavelength" in nm, the default reduction of spectra): the preview of a new study. Nothing is stored',
    tags: ['studies'],
    access: { lab: 'researcher' },
    request: { params: labParamsSchema },
    responses: {
      200: { description: 'The table, a proposed (or the given) mapping and the points', schema: fileReadingSchema },
      400: { description: 'No file, or a mapping that is not one' },
      413: { description: 'Larger than 20 MB or over a reading limit' },
      415: { description: 'Not an accepted file type' },
      422: { description: 'Unreadable (details name row and column) or over the reading time' },
    },
    handler: async ({ req, res }) => {
      const file = await receiveAcceptedFile(req, res);
      const fields = fileReadingFieldsSchema.safeParse(req.body ?? {});
      if (!fields.success)
        throw new AppError(
          'invalid_field',
          `The field ${String(fields.error.issues[0]?.path[0])} ${fields.error.issues[0]?.message ?? 'is not understood'}.`,
          400,
          fields.error.issues.map((issue) => ({ path: `body.${issue.path.join('.')}`, message: issue.message })),
        );
      const { windowStart, windowEnd, emissionWavelength } = fields.data;
      const json = jsonField(fields.data, 'mapping', 'invalid_mapping');
      let mapping = null;
      if (json !== undefined) {
        const parsed = fileReadingMappingSchema.safeParse(json);
        if (!parsed.success)
          throw new AppError('invalid_mapping', 'The mapping is not one Halflight understands.', 400, [
            { path: 'body.mapping', message: parsed.error.issues[0]?.message ?? 'invalid' },
          ]);
        mapping = parsed.data;
      }
      res.json(
        await readFileForPreview(req.app.locals.services, file, mapping, {
          windowStart,
          windowEnd,
          emissionWavelength,
        }),
      );
    },
  }),
];
