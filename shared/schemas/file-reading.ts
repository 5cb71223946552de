import { z } from 'zod';
import { uploadMappingSchema, uploadPreviewSchema } from './study-uploads';

/** What a file gives before anything is kept: the preview of a new study's export. */
export const fileReadingSchema = uploadPreviewSchema
  .omit({ upload: true })
  .extend({ fileName: z.string(), size: z.number().int().describe('bytes') })
  .meta({ id: 'FileReading' });
export type FileReading = z.infer<typeof fileReadingSchema>;

/** The optional multipart field "mapping": JSON of an upload mapping, to read the file another way. */
export const fileReadingFieldsSchema = z.object({ mapping: z.string().optional() });
export const fileReadingMappingSchema = uploadMappingSchema;
