import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { Compound } from './compound.model';
import { measurementTrailAttributes } from './measurement-trail';
import type { Lab } from './lab.model';
import type { User } from './user.model';

/** A ground-state potential exactly as reported: value in V against `reference`, in `solvent`. */
export class RedoxPotential extends Model<InferAttributes<RedoxPotential>, InferCreationAttributes<RedoxPotential>> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare compoundId: ForeignKey<Compound['id']>;
  /** oxidation: E(M+/M); reduction: E(M/M-) */
  declare couple: 'oxidation' | 'reduction';
  /** V */
  declare value: number;
  declare reference: string;
  declare solvent: string;
  declare electrolyte: CreationOptional<string | null>;
  /** half-wave: reversible E1/2; half-peak: Ep/2; peak: Ep of an irreversible wave */
  declare kind: 'half-wave' | 'half-peak' | 'peak';
  declare source: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RedoxPotential.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        couple: { type: DataTypes.ENUM('oxidation', 'reduction'), allowNull: false },
        value: { type: DataTypes.DOUBLE, allowNull: false },
        reference: { type: DataTypes.STRING(40), allowNull: false },
        solvent: { type: DataTypes.STRING(80), allowNull: false },
        electrolyte: { type: DataTypes.STRING(120), allowNull: true },
        kind: { type: DataTypes.ENUM('half-wave', 'half-peak', 'peak'), allowNull: false },
        ...measurementTrailAttributes,
      },
      { sequelize, tableName: 'redox_potentials', version: true },
    );
  }
}
