import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, Sequelize } from 'sequelize';
import { compoundRoleHints } from '@shared/schemas/compound-role';
import type { CompoundRoleHint } from '@shared/schemas/compound-role';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

export class Compound extends LabRecord<Compound> {
  declare name: string;
  declare roleHint: CompoundRoleHint;
  declare smiles: CreationOptional<string | null>;
  declare formula: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare emissiveState: CreationOptional<string | null>;
  /** eV */
  declare tripletEnergy: CreationOptional<number | null>;
  declare tripletEnergySource: CreationOptional<string | null>;
  /** Charge number before electron transfer (0 for neutral), for the Coulomb work term. */
  declare charge: CreationOptional<number>;
  declare createdById: ForeignKey<User['id']> | null;
  /** Optimistic-lock counter: a stale edit gets 409. */
  declare version: CreationOptional<number>;

  static initModel(sequelize: Sequelize): void {
    Compound.init(
      {
        ...recordColumns(),
        name: { type: DataTypes.STRING(160), allowNull: false },
        roleHint: { type: DataTypes.ENUM(...compoundRoleHints), allowNull: false },
        smiles: { type: DataTypes.TEXT, allowNull: true },
        formula: { type: DataTypes.STRING(120), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        emissiveState: { type: DataTypes.STRING(60), allowNull: true },
        tripletEnergy: { type: DataTypes.DOUBLE, allowNull: true },
        tripletEnergySource: { type: DataTypes.TEXT, allowNull: true },
        charge: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'compounds', version: true },
    );
  }
}
