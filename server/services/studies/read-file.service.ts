import type { FileReading } from '@shared/schemas/file-reading';
import type { UploadMapping } from '@shared/schemas/study-uploads';
import { AppError } from '../../lib/app-error';
import type { StudyReading } from './parse/propose-mapping';
import type { UploadServices } from './study-upload.service';

const PREVIEW_POINTS = 200;

/**
 * Reads an instrument export without keeping it (the preview of a study that does not exist
 * yet): the table's first rows, a proposed mapping (or the one given) and the first points.
 * Nothing is stored; the file is kept only when the person confirms and the study is made.
 */
export async function readFileForPreview(
  services: Pick<UploadServices, 'uploadReader'>,
  file: { originalname: string; buffer: Buffer },
  mapping: UploadMapping | null,
  /** the emission window or wavelength typed for the new study: the default reduction of spectra */
  study?: StudyReading,
): Promise<FileReading> {
  const outcome = await services.uploadReader.read(file.originalname, file.buffer, mapping, study);
  if (outcome.kind === 'limit')
    throw new AppError('upload_limit', outcome.message, outcome.limit === 'seconds' ? 422 : 413, [
      { path: 'file', message: `over the ${outcome.limit} limit` },
    ]);
  if (outcome.kind === 'unreadable')
    throw new AppError(
      'upload_unreadable',
      outcome.problems[0]?.message ?? 'The file could not be read.',
      422,
      outcome.problems.map((problem) => ({
        path:
          problem.row === null
            ? 'file'
            : `file.row ${problem.row}${problem.column ? `, column ${problem.column}` : ''}`,
        message: problem.message,
      })),
    );
  return {
    fileName: file.originalname,
    size: file.buffer.length,
    format: outcome.table.format,
    headers: outcome.table.headers,
    rows: outcome.table.rows,
    rowCount: outcome.table.rowCount,
    mapping: outcome.mapping,
    points: outcome.points.slice(0, PREVIEW_POINTS),
    pointCount: outcome.points.length,
    problems: outcome.problems,
    warnings: outcome.warnings,
    questions: outcome.questions,
  };
}
