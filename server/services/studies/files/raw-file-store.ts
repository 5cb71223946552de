import crypto from 'node:crypto';
import { AppError, unavailable } from '../../../lib/app-error';
import { DecayFile, MechanismFile, StudyUpload } from '../../../models';
import type { S3Objects } from './s3-objects';

/** Where a kept upload's bytes are: on its own row, or under a key in object storage. */
export type StoredLocation =
  { storage: 'database'; storageKey: null; content: Buffer } | { storage: 's3'; storageKey: string; content: null };

/** The columns of an upload row that say where its bytes are. */
export interface KeptFile {
  id: string;
  sha256: string;
  storage: 'database' | 's3';
  storageKey: string | null;
  /** the table of the row: a study upload (default), a decay file or a mechanism file */
  kind?: 'study-upload' | 'decay-file' | 'mechanism-file';
}

/**
 * Raw upload files, kept byte for byte. New files go where the store's kind says; a file is
 * read from wherever its row says it is, so a deployment that moved to object storage still
 * reads the files kept in the database before. Every read is checked against the SHA-256
 * recorded when the file arrived.
 */
export interface RawFileStore {
  readonly kind: 'database' | 's3';
  /** Keeps the bytes of a new upload; the returned columns go on its row in the row's transaction. */
  put(file: { uploadId: string; labId: string; bytes: Buffer }): Promise<StoredLocation>;
  /** Removes what put kept when the row was not written after all (nothing to do for the database). */
  discard(location: StoredLocation): Promise<void>;
  read(file: KeptFile): Promise<Buffer>;
}

/** An object store that is down is usually down for longer than a database restart. */
const fileStoreRetryAfterSeconds = 30;

/** The object store did not answer or refused: nothing was changed, and the request can be sent again. */
export const storeUnavailable = (what: string) =>
  unavailable(
    'file_store_unavailable',
    `The file store did not answer (${what}); nothing was changed. Try again in half a minute.`,
    fileStoreRetryAfterSeconds,
  );

const damaged = (file: KeptFile) =>
  new AppError(
    'file_damaged',
    `The kept bytes of upload ${file.id} do not match the SHA-256 recorded when it arrived; the file store needs checking.`,
    500,
  );

/** SHA-256 in hex; SubtleCrypto works on libuv's pool, so 20 MB does not hold the event loop. */
export const sha256Of = async (bytes: Uint8Array) =>
  Buffer.from(await crypto.subtle.digest('SHA-256', bytes)).toString('hex');

/** The object key of an upload: one per upload id, so discarding one never touches another's bytes. */
export const objectKey = (labId: string, uploadId: string) => `labs/${labId}/uploads/${uploadId}`;

/**
 * The store: files in PostgreSQL on the upload row (the default: written in the row's
 * transaction, so kept exactly when the row is), or, with `s3`, in S3-compatible object
 * storage under one key per upload (written before the row's transaction commits and removed
 * again if it does not).
 */
export function createRawFileStore(options: { writeTo: 'database' | 's3'; s3: S3Objects | null }): RawFileStore {
  const { s3 } = options;
  if (options.writeTo === 's3' && !s3) throw new Error('Object storage was chosen for files but is not configured.');
  return {
    kind: options.writeTo,
    async put({ uploadId, labId, bytes }) {
      if (options.writeTo === 'database' || !s3) return { storage: 'database', storageKey: null, content: bytes };
      const key = objectKey(labId, uploadId);
      await s3.put(key, bytes);
      return { storage: 's3', storageKey: key, content: null };
    },
    async discard(location) {
      if (location.storage === 's3') await s3?.remove(location.storageKey).catch(() => {});
    },
    async read(file) {
      let bytes: Buffer | null;
      if (file.storage === 'database') {
        const options = { attributes: ['content'], rejectOnEmpty: true as const };
        const table =
          file.kind === 'decay-file' ? DecayFile : file.kind === 'mechanism-file' ? MechanismFile : StudyUpload;
        bytes = (await (table as typeof StudyUpload).findByPk(file.id, options)).content;
      } else {
        if (!s3) throw storeUnavailable('this upload lives in object storage, and none is configured');
        bytes = await s3.get(file.storageKey!);
      }
      if (!bytes || (await sha256Of(bytes)) !== file.sha256) throw damaged(file);
      return bytes;
    },
  };
}

/**
 * A kept decay or mechanism file of this lab exactly as received (checked against its SHA-256);
 * 404 naming what was asked for when the lab has no such file.
 */
export async function downloadKeptFile(
  files: RawFileStore,
  kind: 'decay-file' | 'mechanism-file',
  labId: string,
  fileId: string,
): Promise<{ fileName: string; content: Buffer }> {
  const table = (kind === 'decay-file' ? DecayFile : MechanismFile) as typeof DecayFile;
  const file = await table.findOne({ where: { id: fileId, labId }, attributes: { exclude: ['content'] } });
  if (!file)
    throw new AppError(
      'not_found',
      `No ${kind === 'decay-file' ? 'decay' : 'mechanism'} file with this id in this lab.`,
      404,
    );
  return { fileName: file.fileName, content: await files.read({ ...file.get({ plain: true }), kind }) };
}
