import type { RawTable } from './read-text-table';

/**
 * The tables read last, by file name and SHA-256 of the bytes: an upload is read on receipt,
 * again for every preview and once more on apply, and a stored upload's bytes never change, so
 * the same bytes under the same name give the same table. Only a few are kept (a 20 MB file
 * reads into a large table); a miss just reads the bytes again. Tables are never changed after
 * reading, so sharing one is safe.
 */
const MAX_TABLES = 2;
const tables = new Map<string, RawTable>();

const keyOf = (fileName: string, sha256: string) => `${sha256}:${fileName}`;

export function cachedTable(fileName: string, sha256: string): RawTable | undefined {
  const key = keyOf(fileName, sha256);
  const table = tables.get(key);
  if (table) {
    // Most recently used last, so the oldest is dropped first.
    tables.delete(key);
    tables.set(key, table);
  }
  return table;
}

export function rememberTable(fileName: string, sha256: string, table: RawTable) {
  tables.set(keyOf(fileName, sha256), table);
  while (tables.size > MAX_TABLES) tables.delete(tables.keys().next().value!);
}
