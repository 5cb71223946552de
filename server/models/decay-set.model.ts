import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { DecayOutcome, DecayReadingSummary, DecayReadOptions } from '@shared/schemas/decays';
import type { Compound } from './compound.model';
import type { DecayFile } from './decay-file.model';
import type { ExcitedStateLifetime } from './excited-state-lifetime.model';
import type { Study } from './study.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

/** A decay file read and fitted as chosen, attached to a study or to an emitter of the library. */
export class DecaySet extends LabRecord<DecaySet> {
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
  declare file?: NonAttribute<DecayFile>;
  declare responseFile?: NonAttribute<DecayFile | null>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    DecaySet.init(
      {
        ...recordColumns(),
        title: { type: DataTypes.STRING(255), allowNull: false },
        reading: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: false },
        outcomes: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'decay_sets', version: true },
    );
  }
}
