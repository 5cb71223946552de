/**
 * Every table whose rows keep a file exactly as received, with StoredFile's columns (storage,
 * storage_key, content, sha256): the one list that the backup, the restore and the move to object
 * storage go through, so a new kind of kept file is not missed by any of them.
 * tests/api/backup-restore.test.ts checks it against the tables of the migrated database that
 * have a storage_key column.
 */
export const storedFileTables = ['study_uploads', 'decay_files', 'mechanism_files'] as const;
export type StoredFileTable = (typeof storedFileTables)[number];
