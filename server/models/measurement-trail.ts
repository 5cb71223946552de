import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, Model } from 'sequelize';
import type { Compound } from './compound.model';
import { LabRecord, recordColumns } from './record';
import type { User } from './user.model';

/**
 * What every per-compound measurement (potential, lifetime, E00) is besides its value: whose lab
 * and compound it belongs to, where it came from, free notes, who entered it, the optimistic-lock
 * version and the timestamps. Each measurement model extends this and declares only its own fields.
 */
export abstract class MeasurementModel<M extends Model> extends LabRecord<M> {
  declare compoundId: ForeignKey<Compound['id']>;
  declare source: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
}

/** The columns of MeasurementModel that are not foreign keys. Matches migration 0004. */
export const measurementTrailAttributes = {
  ...recordColumns(),
  source: { type: DataTypes.TEXT, allowNull: true },
  notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
};
