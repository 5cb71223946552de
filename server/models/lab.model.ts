import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { TimestampedRecord, recordColumns } from './record';

export class Lab extends TimestampedRecord<Lab> {
  declare name: string;
  declare slug: string;
  declare isDemo: CreationOptional<boolean>;
  /** Admins and reviewers of this lab must sign in with a second step. */
  declare requireTwoFactor: CreationOptional<boolean>;
  /** Reference electrode in which the lab reads potentials (engine id, e.g. 'SCE', 'Fc+/Fc'). */
  declare displayReference: CreationOptional<string>;
  declare displaySolvent: CreationOptional<string>;

  static initModel(sequelize: Sequelize): void {
    Lab.init(
      {
        ...recordColumns(),
        name: { type: DataTypes.STRING(160), allowNull: false },
        slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        requireTwoFactor: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        displayReference: { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'SCE' },
        displaySolvent: { type: DataTypes.STRING(80), allowNull: false, defaultValue: 'acetonitrile' },
      },
      { sequelize, tableName: 'labs' },
    );
  }
}
