import type { Request, Response } from 'express';
import multer from 'multer';
import { AppError } from '../lib/app-error';
import { ACCEPTED_EXTENSIONS, isAcceptedFile, MAX_UPLOAD_BYTES } from '../services/studies/parse/read-upload';

/** What a route accepts in a multipart upload besides the file in the field "file". */
export interface FilesSpec {
  /** What the field "file" holds, for the messages ("the decays", "the spectra"). */
  what: string;
  /** An optional second file, in a field of this name (a response file, the quencher's spectrum). */
  second?: string;
  /** How many text fields may come with the files, and how long each may be (bytes). */
  fields: number;
  fieldSize?: number;
}

/** The files and text fields of one upload, each file of a type Halflight reads. */
export interface ReceivedFiles {
  file: Express.Multer.File;
  second: Express.Multer.File | null;
  fields: Record<string, unknown>;
}

/**
 * A receiver for one route's uploads: runs multer inside the handler (memory storage, 20 MB a
 * file), so the route stays one defineRoute spec, and refuses what should not go further: not
 * multipart or no file (400 naming body.file), a file too large (413), a type Halflight does not
 * read (415, by the file's extension).
 */
export function filesReceiver(spec: FilesSpec): (req: Request, res: Response) => Promise<ReceivedFiles> {
  const upload = multer({
    storage: multer.memoryStorage(),
    // Browsers send UTF-8 names without saying so; multer's default (latin1) turned "μM" into "Î¼M".
    defParamCharset: 'utf8',
    limits: { fileSize: MAX_UPLOAD_BYTES, files: spec.second ? 2 : 1, fields: spec.fields, fieldSize: spec.fieldSize },
  }).fields([{ name: 'file', maxCount: 1 }, ...(spec.second ? [{ name: spec.second, maxCount: 1 }] : [])]);
  const noFile = (message: string) =>
    new AppError('no_file', message, 400, [{ path: 'body.file', message: 'missing' }]);

  return (req, res) => {
    if (!req.is('multipart/form-data'))
      return Promise.reject(noFile(`Send ${spec.what} as multipart/form-data in a field named "file".`));
    return new Promise((resolve, reject) => {
      upload(req, res, (error: unknown) => {
        if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE') {
          req.resume(); // read the rest, so the client gets the answer rather than a reset connection
          const which = spec.second ? 'A file' : 'The file';
          return reject(
            new AppError(
              'file_too_large',
              `${which} is larger than the ${MAX_UPLOAD_BYTES / 1024 / 1024} MB limit.`,
              413,
            ),
          );
        }
        if (error) return reject(new AppError('bad_upload', (error as Error).message, 400));
        const files = (req.files ?? {}) as Record<string, Express.Multer.File[] | undefined>;
        const file = files.file?.[0];
        if (!file) return reject(noFile(`No file arrived; send ${spec.what} in a field named "file".`));
        const second = (spec.second && files[spec.second]?.[0]) || null;
        for (const sent of [file, second])
          if (sent && !isAcceptedFile(sent.originalname))
            return reject(
              new AppError(
                'unsupported_type',
                `"${sent.originalname}" is not a file type Halflight reads; send ${ACCEPTED_EXTENSIONS.join(', ')}.`,
                415,
              ),
            );
        resolve({ file, second, fields: (req.body ?? {}) as Record<string, unknown> });
      });
    });
  };
}

const receiveOne = filesReceiver({ what: 'the file', fields: 5 });

/** One file of a type Halflight reads (its text fields stay on req.body): study uploads, file readings, spectrum matrices. */
export async function receiveAcceptedFile(req: Request, res: Response): Promise<Express.Multer.File> {
  return (await receiveOne(req, res)).file;
}

/**
 * A text field that carries JSON (decay options, a column mapping): undefined when absent or
 * blank, 400 naming the field when it is not JSON.
 */
export function jsonField(fields: Record<string, unknown>, name: string, code = 'validation_failed'): unknown {
  const text = fields[name];
  if (typeof text !== 'string' || text.trim() === '') return undefined;
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError(code, `The field "${name}" is not JSON.`, 400, [{ path: `body.${name}`, message: 'not JSON' }]);
  }
}
