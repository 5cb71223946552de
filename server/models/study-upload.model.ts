import { DataTypes, Model } from 'sequelize';
import type {
  CreationOptional,
  ForeignKey,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize';
import type { Lab } from './lab.model';
import type { Study } from './study.model';
import type { User } from './user.model';

/** A raw instrument file exactly as received, kept also when it does not parse. */
export class StudyUpload extends Model<InferAttributes<StudyUpload>, InferCreationAttributes<StudyUpload>> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare studyId: ForeignKey<Study['id']>;
  declare fileName: string;
  declare mediaType: string;
  declare size: number;
  declare sha256: string;
  /** where the bytes are: on this row (content) or in object storage (storageKey) */
  declare storage: CreationOptional<'database' | 's3'>;
  declare storageKey: string | null;
  declare content: Buffer | null;
  declare uploadedById: ForeignKey<User['id']> | null;
  declare parseStatus: 'parsed' | 'failed' | 'applied';
  declare parseReport: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare uploadedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    StudyUpload.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        mediaType: { type: DataTypes.STRING(120), allowNull: false },
        size: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
        storage: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'database' },
        storageKey: { type: DataTypes.STRING(512), allowNull: true },
        content: { type: DataTypes.BLOB, allowNull: true },
        parseStatus: { type: DataTypes.ENUM('parsed', 'failed', 'applied'), allowNull: false },
        parseReport: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'study_uploads' },
    );
  }
}
