import { Op } from 'sequelize';
import { DecayFile, MechanismFile, StudyUpload } from '../../../models';
import { objectKey, sha256Of } from './raw-file-store';
import type { S3Objects } from './s3-objects';
import { storedFileTables, type StoredFileTable } from './stored-file-tables';

const BATCH = 50;

/** The model and the words of each table of kept files (stored-file-tables.ts lists them; a new one must be named here). */
const keptFileTables: Record<StoredFileTable, { name: string; model: unknown }> = {
  study_uploads: { name: 'upload', model: StudyUpload },
  decay_files: { name: 'decay file', model: DecayFile },
  mechanism_files: { name: 'mechanism file', model: MechanismFile },
};

/**
 * Moves every file kept in the database (study uploads, decay files, mechanism files) into object storage,
 * one at a time: the bytes are checked against their SHA-256, written, read back and checked
 * again, and only then does the row point at the object and drop its copy (one UPDATE, so a
 * stop half-way leaves each file either moved or where it was). A file that fails a check stays
 * in the database and is reported. Running it again carries on where it stopped. `labId` moves
 * one lab's files only.
 */
export async function moveFilesToS3(s3: S3Objects, log: (line: string) => void, options: { labId?: string } = {}) {
  let moved = 0;
  let refused = 0;
  for (const { name, model } of storedFileTables.map((table) => keptFileTables[table])) {
    // The classes share StoredFile's columns; Sequelize's static methods do not take a union of classes.
    const table = model as unknown as typeof StudyUpload;
    let after = '00000000-0000-0000-0000-000000000000';
    for (;;) {
      const batch = await table.findAll({
        where: { storage: 'database', id: { [Op.gt]: after }, ...(options.labId ? { labId: options.labId } : {}) },
        attributes: ['id', 'labId', 'sha256', 'fileName'],
        order: [['id', 'ASC']],
        limit: BATCH,
      });
      if (batch.length === 0) break;
      for (const file of batch) {
        after = file.id;
        const outcome = await moveOne(s3, table, file, `${name} ${file.id} ("${file.fileName}")`, log);
        if (outcome === 'moved') moved += 1;
        if (outcome === 'refused') refused += 1;
      }
    }
  }
  return { moved, refused };
}

async function moveOne(
  s3: S3Objects,
  table: typeof StudyUpload,
  file: { id: string; labId: string; sha256: string },
  name: string,
  log: (line: string) => void,
): Promise<'moved' | 'refused' | 'gone'> {
  const content = (await table.findByPk(file.id, { attributes: ['content'], rejectOnEmpty: true })).content;
  if (!content || (await sha256Of(content)) !== file.sha256) {
    log(`${name}: its bytes in the database do not match the SHA-256 recorded on arrival; left where it is.`);
    return 'refused';
  }
  const key = objectKey(file.labId, file.id);
  await s3.put(key, content);
  if ((await sha256Of(await s3.get(key))) !== file.sha256) {
    await s3.remove(key);
    log(`${name}: the copy read back from object storage differs; left in the database.`);
    return 'refused';
  }
  const [changed] = await table.update(
    { storage: 's3', storageKey: key, content: null },
    { where: { id: file.id, storage: 'database' } },
  );
  if (changed === 0) return 'gone';
  log(`${name}: moved to ${key}, SHA-256 checked.`);
  return 'moved';
}
