import path from 'node:path';
import { ParseProblem } from './parse-problem';
import { readJcamp } from './read-jcamp';
import { readTextTable, type RawTable } from './read-text-table';
import { readWorkbook } from './read-workbook';
import { DEFAULT_UPLOAD_LIMITS, type UploadLimits } from './upload-limits';

/** File kinds accepted for upload, by extension (browsers send unreliable media types for CSV). */
export const TEXT_EXTENSIONS = ['.csv', '.tsv', '.txt', '.dat', '.asc'];
export const WORKBOOK_EXTENSIONS = ['.xlsx'];
/** JCAMP-DX (IUPAC): .jdx and .dx are the usual names. */
export const JCAMP_EXTENSIONS = ['.jdx', '.dx', '.jcamp'];
export const ACCEPTED_EXTENSIONS = [...TEXT_EXTENSIONS, ...WORKBOOK_EXTENSIONS, ...JCAMP_EXTENSIONS];
export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

export const isAcceptedFile = (fileName: string) => ACCEPTED_EXTENSIONS.includes(path.extname(fileName).toLowerCase());

/**
 * Reads an accepted upload into a table; throws ParseProblem naming what is wrong, or
 * UploadLimitExceeded naming the limit the file goes over (checked while reading).
 */
export async function readUpload(
  fileName: string,
  bytes: Buffer,
  limits: UploadLimits = DEFAULT_UPLOAD_LIMITS,
): Promise<RawTable> {
  if (bytes.length === 0) throw new ParseProblem('The file is empty.');
  const extension = path.extname(fileName).toLowerCase();
  if (WORKBOOK_EXTENSIONS.includes(extension)) return readWorkbook(bytes, limits);
  if (JCAMP_EXTENSIONS.includes(extension)) return readJcamp(bytes, limits);
  return readTextTable(bytes, limits);
}
