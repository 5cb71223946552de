import crypto from 'node:crypto';
import { ENGINE_VERSION } from '@shared/engine';
import type { Includeable, Model, ModelStatic, Transaction, WhereOptions } from 'sequelize';
import type { SignedInActor } from '../../../domain/actor';
import type { LabContext } from '../../../domain/lab-context';
import { AppError } from '../../../lib/app-error';
import type { DecayFile, MechanismFile } from '../../../models';
import type { UploadLimits } from '../parse/upload-limits';
import type { Problem } from '../parse/read-and-map';
import { loadStudy } from '../study-access';
import type { UploadServices } from '../study-upload.service';
import { sha256Of, type StoredLocation } from './raw-file-store';

/*
 * What a record read from kept files (a decay set, a spectrum matrix) does with them: refuse a file
 * that cannot be read, keep the bytes and their rows with the record in one transaction, and answer
 * each file by its name, size and hash. The record's own table and answer stay with its feature.
 */

/** A file as multer hands it over. */
export interface ReceivedFile {
  originalname: string;
  mimetype: string;
  buffer: Buffer;
}

/** A received file whose bytes are in the file store: the id and hash its row will carry. */
export interface KeptBytes {
  id: string;
  file: ReceivedFile;
  sha256: string;
  location: StoredLocation;
}

/** The tables that hold a kept file's row (both extend StoredFile). */
type FileTable = typeof DecayFile | typeof MechanismFile;

/** A reading thread's answer when it did not read the file. */
export type NotRead =
  { kind: 'unreadable'; problems: Problem[] } | { kind: 'limit'; limit: keyof UploadLimits; message: string };

/** Over an upload limit: 413 (422 for the time limit) naming the limit; nothing was kept (or, reading a kept file again, changed). */
export function refuseOverLimit(
  outcome: Extract<NotRead, { kind: 'limit' }>,
  consequence = 'Nothing was kept.',
): never {
  throw new AppError('upload_limit', `${outcome.message} ${consequence}`, outcome.limit === 'seconds' ? 422 : 413, [
    { path: 'file', message: `over the ${outcome.limit} limit` },
  ]);
}

/** Unreadable (422 with `code`, naming each cell's column, else its row) or over a limit; nothing was kept (or changed). */
export function refuseUnread(outcome: NotRead, code: string, consequence = 'Nothing was kept.'): never {
  if (outcome.kind === 'limit') refuseOverLimit(outcome, consequence);
  throw new AppError(
    code,
    `${outcome.problems[0]!.message} ${consequence}`,
    422,
    outcome.problems.map((problem) => ({
      path: problem.column ? `file.column ${problem.column}` : problem.row ? `file.row ${problem.row}` : 'file',
      message: problem.message,
    })),
  );
}

/**
 * Keeps received files with the record `write` makes from them. The bytes go to the file store
 * first; their rows (in `table`) and whatever `write` adds follow in one transaction, and the stored
 * bytes are removed again if it does not commit.
 */
export async function keepWithFiles<T>(
  services: UploadServices,
  lab: LabContext,
  actor: SignedInActor,
  table: FileTable,
  received: ReceivedFile[],
  write: (kept: KeptBytes[], transaction: Transaction) => Promise<T>,
): Promise<T> {
  const kept: KeptBytes[] = [];
  try {
    for (const file of received) {
      const id = crypto.randomUUID();
      const sha256 = await sha256Of(file.buffer);
      const location = await services.files.put({ uploadId: id, labId: lab.id, bytes: file.buffer });
      kept.push({ id, file, sha256, location });
    }
    return await services.sequelize.transaction(async (transaction) => {
      for (const { id, file, sha256, location } of kept)
        await (table as typeof DecayFile).create(
          {
            ...location,
            id,
            labId: lab.id,
            fileName: file.originalname.slice(0, 255),
            mediaType: file.mimetype || 'application/octet-stream',
            size: file.buffer.length,
            sha256,
            uploadedById: actor.userId,
          },
          { transaction },
        );
      return write(kept, transaction);
    });
  } catch (error) {
    for (const { location } of kept) await services.files.discard(location);
    throw error;
  }
}

/**
 * The columns a record analysed from kept files (a spectrum matrix, an absorption titration)
 * writes besides its own: its lab and study, what the engine read and found, who kept it and
 * with which engine version.
 */
export const analysedRecordColumns = <R, A, P>(
  lab: LabContext,
  studyId: string,
  actor: SignedInActor,
  outcome: { reading: R; analysis: A; plot: P },
) => ({ labId: lab.id, studyId, ...reanalysedColumns(outcome), createdById: actor.userId });

/** What analysing a kept record again rewrites: what the engine read and found, and its version. */
export const reanalysedColumns = <R, A, P>({ reading, analysis, plot }: { reading: R; analysis: A; plot: P }) => ({
  reading,
  analysis,
  plot,
  engineVersion: ENGINE_VERSION,
});

/** A kept file as the audit log names it. */
export const keptFileDetails = ({ id, file, sha256 }: KeptBytes) => ({
  id,
  fileName: file.originalname,
  size: file.buffer.length,
  sha256,
});

/** A kept file as an answer names it (its bytes come from the download route). */
export const keptFileAnswer = (row: {
  id: string;
  fileName: string;
  size: number;
  sha256: string;
  createdAt: Date;
}) => ({
  id: row.id,
  fileName: row.fileName,
  size: row.size,
  sha256: row.sha256,
  createdAt: row.createdAt.toISOString(),
});

/** Includes a record's file row under `as`, without its bytes. */
export const fileRowWithoutBytes = (table: FileTable, as: string) => ({
  model: table,
  as,
  attributes: { exclude: ['content'] },
});

/** A study's records of one kind (decay sets, spectrum matrices), newest first; 404 for another lab's study. */
export async function listOfStudy<M extends Model>(
  table: ModelStatic<M>,
  lab: LabContext,
  studyId: string,
  include: Includeable[],
): Promise<M[]> {
  await loadStudy(lab, studyId);
  const where: WhereOptions = { labId: lab.id, studyId };
  return table.findAll({ where, include, order: [['createdAt', 'DESC']] });
}
