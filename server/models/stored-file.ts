import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, Model } from 'sequelize';
import { LabRecord, recordColumns } from './record';
import type { User } from './user.model';

/**
 * What every file Halflight keeps exactly as received has: its name, type, size and SHA-256, and
 * where its bytes are. The study uploads and the decay files extend it with their own columns.
 */
export abstract class StoredFile<M extends Model> extends LabRecord<M> {
  declare fileName: string;
  declare mediaType: string;
  declare size: number;
  declare sha256: string;
  /** where the bytes are: on this row (content) or in object storage (storageKey) */
  declare storage: CreationOptional<'database' | 's3'>;
  declare storageKey: string | null;
  declare content: Buffer | null;
  declare uploadedById: ForeignKey<User['id']> | null;
}

/**
 * The columns of a stored file (the foreign keys come from the associations in models/index.ts).
 * A fresh object per call: Sequelize's init writes into each attribute it is given.
 */
export const storedFileColumns = () => ({
  ...recordColumns(),
  fileName: { type: DataTypes.STRING(255), allowNull: false },
  mediaType: { type: DataTypes.STRING(120), allowNull: false },
  size: { type: DataTypes.INTEGER, allowNull: false },
  sha256: { type: DataTypes.STRING(64), allowNull: false },
  storage: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'database' },
  storageKey: { type: DataTypes.STRING(512), allowNull: true },
  content: { type: DataTypes.BLOB, allowNull: true },
});
