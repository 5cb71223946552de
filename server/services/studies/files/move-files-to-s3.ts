import { Op } from 'sequelize';
import { StudyUpload } from '../../../models';
import { objectKey, sha256Of } from './raw-file-store';
import type { S3Objects } from './s3-objects';

const BATCH = 50;

/**
 * Moves every upload kept in the database into object storage, one at a time: the bytes are
 * checked against their SHA-256, written, read back and checked again, and only then does the
 * row point at the object and drop its copy (one UPDATE, so a stop half-way leaves each file
 * either moved or where it was). A file that fails a check stays in the database and is
 * reported. Running it again carries on where it stopped. `labId` moves one lab's files only.
 */
export async function moveFilesToS3(s3: S3Objects, log: (line: string) => void, options: { labId?: string } = {}) {
  let moved = 0;
  let refused = 0;
  let after = '00000000-0000-0000-0000-000000000000';
  for (;;) {
    const batch = await StudyUpload.findAll({
      where: { storage: 'database', id: { [Op.gt]: after }, ...(options.labId ? { labId: options.labId } : {}) },
      attributes: ['id', 'labId', 'sha256', 'fileName'],
      order: [['id', 'ASC']],
      limit: BATCH,
    });
    if (batch.length === 0) break;
    for (const upload of batch) {
      after = upload.id;
      const content = (await StudyUpload.findByPk(upload.id, { attributes: ['content'], rejectOnEmpty: true })).content;
      const name = `upload ${upload.id} ("${upload.fileName}")`;
      if (!content || (await sha256Of(content)) !== upload.sha256) {
        refused += 1;
        log(`${name}: its bytes in the database do not match the SHA-256 recorded on arrival; left where it is.`);
        continue;
      }
      const key = objectKey(upload.labId, upload.id);
      await s3.put(key, content);
      if ((await sha256Of(await s3.get(key))) !== upload.sha256) {
        refused += 1;
        await s3.remove(key);
        log(`${name}: the copy read back from object storage differs; left in the database.`);
        continue;
      }
      const [changed] = await StudyUpload.update(
        { storage: 's3', storageKey: key, content: null },
        { where: { id: upload.id, storage: 'database' } },
      );
      moved += changed;
      log(`${name}: moved to ${key}, SHA-256 checked.`);
    }
  }
  return { moved, refused };
}
