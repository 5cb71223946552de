import type { StudyPointValues } from '@shared/schemas/study-points';
import type { UploadMapping, UploadQuestion } from '@shared/schemas/study-uploads';
import { applyMapping } from './apply-mapping';
import { ParseProblem } from './parse-problem';
import { mappingNotes, NO_STUDY_READING, proposeWithNotes, type StudyReading } from './propose-mapping';
import { questionPoints } from './question-points';
import { readUpload } from './read-upload';
import { limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

/** What the reading thread is asked: the bytes, and the mapping to apply (null: propose one). */
export interface ReadTask {
  fileName: string;
  bytes: Uint8Array;
  mapping: UploadMapping | null;
  limits: UploadLimits;
  /** the study's emission window or wavelength, the default reduction of spectra */
  study?: StudyReading;
}

export interface Problem {
  row: number | null;
  column: string | null;
  message: string;
}

/** The table as far as an answer shows it: its shape and first rows, never every cell. */
export interface TableGlimpse {
  format: string;
  headers: string[];
  rows: string[][];
  rowCount: number;
}

export type ReadOutcome =
  | {
      kind: 'read';
      table: TableGlimpse;
      mapping: UploadMapping;
      points: StudyPointValues[];
      problems: Problem[];
      warnings: string[];
      /** doubts about the points (a unit slip?) that applying needs acknowledged */
      questions: UploadQuestion[];
    }
  | { kind: 'unreadable'; problems: Problem[] }
  | { kind: 'limit'; limit: keyof UploadLimits; message: string };

/** At most 200 rows, fewer for a wide table, so an answer holds at most about 20,000 cells. */
const GLIMPSE_CELLS = 20_000;
const GLIMPSE_ROWS = 200;
const GLIMPSE_CELL_CHARACTERS = 200;

const toProblem = (problem: ParseProblem): Problem => ({
  row: problem.row,
  column: problem.column,
  message: problem.message,
});

/**
 * Reads an upload and applies a mapping (the proposed one when none is given), in the reading
 * thread: the whole table lives and dies there, and only the glimpse, the mapping and the points
 * travel back. Every outcome is plain data (errors do not keep their class across threads).
 */
export async function readAndMap(task: ReadTask): Promise<ReadOutcome> {
  try {
    const table = await readUpload(
      task.fileName,
      Buffer.from(task.bytes.buffer, task.bytes.byteOffset, task.bytes.byteLength),
      task.limits,
    );
    const proposal = task.mapping ? null : proposeWithNotes(table, task.study ?? NO_STUDY_READING);
    const mapping = task.mapping ?? proposal!.mapping;
    const unitOpen = mapping.layout === 'series' && mapping.concentrationUnit === null;
    // Without a concentration unit there are no points yet: the preview asks for the unit first.
    const { points, problems } = unitOpen ? { points: [], problems: [] } : applyMapping(table, mapping);
    const unitNote = unitOpen
      ? [
          `The concentration column "${table.headers[mapping.concentration] ?? ''}" names no unit: choose M, mM, µM or nM (Halflight does not guess one).`,
        ]
      : [];
    const questions = questionPoints(points, mapping.layout === 'series' && mapping.intensityIsRatio);
    if (points.length > task.limits.seriesPoints)
      throw new UploadLimitExceeded('seriesPoints', limitMessage.seriesPoints(task.limits, points.length));
    const shownRows = Math.max(
      10,
      Math.min(GLIMPSE_ROWS, Math.floor(GLIMPSE_CELLS / Math.max(1, table.headers.length))),
    );
    return {
      kind: 'read',
      table: {
        format: table.format,
        headers: table.headers,
        rows: table.rows
          .slice(0, shownRows)
          .map((row) => row.cells.map((cell) => cell.slice(0, GLIMPSE_CELL_CHARACTERS))),
        rowCount: table.rows.length,
      },
      mapping,
      points,
      problems: problems.map(toProblem),
      warnings: [...(proposal?.notes ?? []), ...unitNote, ...mappingNotes(table, mapping)],
      questions,
    };
  } catch (error) {
    if (error instanceof ParseProblem) return { kind: 'unreadable', problems: [toProblem(error)] };
    if (error instanceof UploadLimitExceeded) return { kind: 'limit', limit: error.limit, message: error.message };
    throw error;
  }
}
