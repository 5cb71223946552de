import { z } from 'zod';
import { uploadMappingSchema, uploadPreviewSchema } from './study-uploads';

/** What a file gives before anything is kept: the preview of a new study's export. */
export const fileReadingSchema = uploadPreviewSchema
  .omit({ upload: true })
  .extend({ fileName: z.string(), size: z.number().int().describe('bytes') })
  .meta({ id: 'FileReading' });
export type FileReading = z.infer<typeof fileReadingSchema>;

/** A wavelength typed on the New study form, sent as a multipart text field (nm; blank means none). */
const typedWavelength = z
  .string()
  .optional()
  .transform((text) => (text === undefined || text.trim() === '' ? null : Number(text)))
  .refine((value) => value === null || (Number.isFinite(value) && value > 0), 'must be a wavelength in nm');

/**
 * The optional multipart fields: "mapping", JSON of an upload mapping, to read the file another
 * way; and the new study's emission window or wavelength (nm), so spectra are proposed over it.
 */
export const fileReadingFieldsSchema = z.object({
  mapping: z.string().optional(),
  windowStart: typedWavelength,
  windowEnd: typedWavelength,
  emissionWavelength: typedWavelength,
});
export const fileReadingMappingSchema = uploadMappingSchema;
