import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import { StoredFile, storedFileColumns } from './stored-file';
import type { Study } from './study.model';
import type { User } from './user.model';

/** A raw instrument file exactly as received, kept also when it does not parse. */
export class StudyUpload extends StoredFile<StudyUpload> {
  declare studyId: ForeignKey<Study['id']>;
  declare parseStatus: 'parsed' | 'failed' | 'applied';
  declare parseReport: Record<string, unknown>;
  declare uploadedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    StudyUpload.init(
      {
        ...storedFileColumns(),
        parseStatus: { type: DataTypes.ENUM('parsed', 'failed', 'applied'), allowNull: false },
        parseReport: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'study_uploads' },
    );
  }
}
