import type { Sequelize } from 'sequelize';
import { StoredFile, storedFileColumns } from './stored-file';

/** A decay histogram file (or its response file) exactly as received, with its SHA-256. */
export class DecayFile extends StoredFile<DecayFile> {
  static initModel(sequelize: Sequelize): void {
    DecayFile.init(storedFileColumns(), { sequelize, tableName: 'decay_files' });
  }
}
