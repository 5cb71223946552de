import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes } from 'sequelize';
import type { Lab } from './lab.model';

/** A record with a UUID key and no timestamps (the model passes `timestamps: false`); columns from keyColumns(). */
export abstract class KeyedRecord<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<string>;
}

/**
 * A record written once: a UUID key and when it was made (its table has no updated_at, so the model
 * passes `updatedAt: false`). Its columns start with createdRecordColumns().
 */
export abstract class CreatedRecord<M extends Model> extends KeyedRecord<M> {
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

/** The column of KeyedRecord. A fresh object per call: Sequelize's init writes into each attribute. */
export const keyColumns = () => ({
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
});

/** The columns of CreatedRecord, likewise fresh per call. */
export const createdRecordColumns = () => ({ ...keyColumns(), createdAt: DataTypes.DATE });

/** The columns of TimestampedRecord (and LabRecord), likewise fresh per call. */
export const recordColumns = () => ({ ...createdRecordColumns(), updatedAt: DataTypes.DATE });
