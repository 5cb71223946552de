import { Op, type Transaction } from 'sequelize';
import { AbsorptionTitration, MechanismFile } from '../../models';
import type { StoredLocation } from '../studies/files/raw-file-store';

/**
 * After a spectrum matrix or absorption titration is removed: removes the rows of its kept files
 * that no other record still names (a study's revisions share their files, copySpectrumMatrices),
 * and answers their ids and where their bytes lie in object storage, to remove after the commit
 * (bytes kept in PostgreSQL go with their rows). Files still named by another record stay whole.
 */
export async function releaseMechanismFiles(
  labId: string,
  files: MechanismFile[],
  transaction: Transaction,
): Promise<{ removed: string[]; locations: StoredLocation[] }> {
  const ids = files.map((file) => file.id);
  // Both kinds live in spectrum_matrices; the absorption model names both file columns.
  const stillNamed = await AbsorptionTitration.unscoped().findAll({
    where: { labId, [Op.or]: [{ fileId: ids }, { quencherFileId: ids }] },
    attributes: ['fileId', 'quencherFileId'],
    transaction,
  });
  const named = new Set(stillNamed.flatMap((row) => [row.fileId, row.quencherFileId]));
  const unshared = files.filter((file) => !named.has(file.id));
  const removed = unshared.map((file) => file.id);
  if (removed.length > 0) await MechanismFile.destroy({ where: { id: removed, labId }, transaction });
  const locations = unshared.flatMap((file): StoredLocation[] =>
    file.storage === 's3' && file.storageKey ? [{ storage: 's3', storageKey: file.storageKey, content: null }] : [],
  );
  return { removed, locations };
}
