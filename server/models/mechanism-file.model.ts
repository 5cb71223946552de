import type { Sequelize } from 'sequelize';
import { StoredFile, storedFileColumns } from './stored-file';

/** A file of mechanism evidence (a spectrum matrix) exactly as received, with its SHA-256. */
export class MechanismFile extends StoredFile<MechanismFile> {
  static initModel(sequelize: Sequelize): void {
    MechanismFile.init(storedFileColumns(), { sequelize, tableName: 'mechanism_files' });
  }
}
