import type { DecayOutcome, DecayReadOptions } from '@shared/schemas/decays';
import { ParseProblem } from '../studies/parse/parse-problem';
import type { Problem } from '../studies/parse/read-and-map';
import { UploadLimitExceeded, type UploadLimits } from '../studies/parse/upload-limits';
import { fitDecaySet, type DecaySetReading } from './fit-decay-set';
import { readDecayTable } from './read-decay-table';

/** What a reading thread is asked for a decay set: the file, its response file if any, and the choices. */
export interface DecayReadTask {
  fileName: string;
  bytes: Uint8Array;
  response: { fileName: string; bytes: Uint8Array } | null;
  options: DecayReadOptions;
  /** the stored outcomes of a kept set: its curves are drawn from them, nothing is fitted again */
  stored: DecayOutcome[] | null;
  limits: UploadLimits;
}

export type DecayReadOutcome =
  | ({ kind: 'read' } & DecaySetReading)
  | { kind: 'unreadable'; problems: Problem[] }
  | { kind: 'limit'; limit: keyof UploadLimits; message: string };

const asBuffer = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);

/**
 * Reads and fits a decay set in a reading thread (upload-reader.ts runs it by name): the
 * tables and the fits live there, and only plain data comes back. A problem in the response
 * file names that file.
 */
export async function readDecays(task: DecayReadTask): Promise<DecayReadOutcome> {
  let file = task.fileName;
  try {
    const table = await readDecayTable(task.fileName, asBuffer(task.bytes), task.limits);
    file = task.response?.fileName ?? file;
    const response = task.response
      ? await readDecayTable(task.response.fileName, asBuffer(task.response.bytes), task.limits)
      : null;
    file = task.fileName;
    return { kind: 'read', ...fitDecaySet(table, response, task.options, task.stored) };
  } catch (error) {
    if (error instanceof ParseProblem)
      return {
        kind: 'unreadable',
        problems: [
          {
            row: error.row,
            column: error.column,
            message: file === task.fileName ? error.message : `${file}: ${error.message}`,
          },
        ],
      };
    if (error instanceof UploadLimitExceeded) return { kind: 'limit', limit: error.limit, message: error.message };
    throw error;
  }
}
