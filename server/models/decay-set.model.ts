import { DataTypes, Model } from 'sequelize';
import type {
  CreationOptional,
  ForeignKey,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize';
import type { DecayOutcome, DecayReadingSummary, DecayReadOptions } from '@shared/schemas/decays';
import type { Compound } from './compound.model';
import type { DecayFile } from './decay-file.model';
import type { ExcitedStateLifetime } from './excited-state-lifetime.model';
import type { Lab } from './lab.model';
import type { Study } from './study.model';
import type { User } from './user.model';

/** A decay file read and fitted as chosen, attached to a study or to an emitter of the library. */
export class DecaySet extends Model<InferAttributes<DecaySet>, InferCreationAttributes<DecaySet>> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare studyId: ForeignKey<Study['id']> | null;
  declare compoundId: ForeignKey<Compound['id']> | null;
  declare lifetimeId: ForeignKey<ExcitedStateLifetime['id']> | null;
  declare title: string;
  declare fileId: ForeignKey<DecayFile['id']>;
  declare responseFileId: ForeignKey<DecayFile['id']> | null;
  /** the file as read: format, time unit, channel width, column roles */
  declare reading: DecayReadingSummary;
  /** the choices it was read and fitted with (time unit, columns, model, rates) */
  declare options: DecayReadOptions;
  /** one per decay: its fit (exact parameters) or why it has none */
  declare outcomes: DecayOutcome[];
  declare engineVersion: string;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare file?: NonAttribute<DecayFile>;
  declare responseFile?: NonAttribute<DecayFile | null>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    DecaySet.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        title: { type: DataTypes.STRING(255), allowNull: false },
        reading: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: false },
        outcomes: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'decay_sets', version: true },
    );
  }
}
