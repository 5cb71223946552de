import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes } from 'sequelize';
import type { Lab } from './lab.model';
import type { User } from './user.model';

/**
 * What every file Halflight keeps exactly as received has: its name, type, size and SHA-256, and
 * where its bytes are. The study uploads and the decay files extend it with their own columns.
 */
export abstract class StoredFile<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare fileName: string;
  declare mediaType: string;
  declare size: number;
  declare sha256: string;
  /** where the bytes are: on this row (content) or in object storage (storageKey) */
  declare storage: CreationOptional<'database' | 's3'>;
  declare storageKey: string | null;
  declare content: Buffer | null;
  declare uploadedById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/**
 * The columns of a stored file (the foreign keys come from the associations in models/index.ts).
 * A fresh object per call: Sequelize's init writes into each attribute it is given.
 */
export const storedFileColumns = () => ({
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
  fileName: { type: DataTypes.STRING(255), allowNull: false },
  mediaType: { type: DataTypes.STRING(120), allowNull: false },
  size: { type: DataTypes.INTEGER, allowNull: false },
  sha256: { type: DataTypes.STRING(64), allowNull: false },
  storage: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'database' },
  storageKey: { type: DataTypes.STRING(512), allowNull: true },
  content: { type: DataTypes.BLOB, allowNull: true },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
});
