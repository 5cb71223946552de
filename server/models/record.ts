import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes } from 'sequelize';
import type { Lab } from './lab.model';

/**
 * A record written once: a UUID key and when it was made (its table has no updated_at, so the model
 * passes `updatedAt: false`). Its columns start with createdRecordColumns().
 */
export abstract class CreatedRecord<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
}

/**
 * What most of Halflight's tables have: a UUID key and the two timestamps Sequelize keeps. A model
 * extends this (or LabRecord) and declares only its own fields; its columns start with recordColumns().
 */
export abstract class TimestampedRecord<M extends Model> extends CreatedRecord<M> {
  declare updatedAt: CreationOptional<Date>;
}

/** A record that belongs to one lab (the foreign key comes from the associations in models/index.ts). */
export abstract class LabRecord<M extends Model> extends TimestampedRecord<M> {
  declare labId: ForeignKey<Lab['id']>;
}

/** The columns of CreatedRecord. A fresh object per call: Sequelize's init writes into each attribute. */
export const createdRecordColumns = () => ({
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
  createdAt: DataTypes.DATE,
});

/** The columns of TimestampedRecord (and LabRecord), likewise fresh per call. */
export const recordColumns = () => ({ ...createdRecordColumns(), updatedAt: DataTypes.DATE });
