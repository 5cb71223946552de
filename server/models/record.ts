import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes } from 'sequelize';
import type { Lab } from './lab.model';

/**
 * What most of Halflight's tables have: a UUID key and the two timestamps Sequelize keeps. A model
 * extends this (or LabRecord) and declares only its own fields; its columns start with recordColumns().
 */
export abstract class TimestampedRecord<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A record that belongs to one lab (the foreign key comes from the associations in models/index.ts). */
export abstract class LabRecord<M extends Model> extends TimestampedRecord<M> {
  declare labId: ForeignKey<Lab['id']>;
}

/** The columns of TimestampedRecord. A fresh object per call: Sequelize's init writes into each attribute. */
export const recordColumns = () => ({
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
});
