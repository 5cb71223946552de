import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { MeasurementModel, measurementTrailAttributes } from './measurement-trail';

/** A ground-state potential exactly as reported: value in V against `reference`, in `solvent`. */
export class RedoxPotential extends MeasurementModel<RedoxPotential> {
  /** oxidation: E(M+/M); reduction: E(M/M-) */
  declare couple: 'oxidation' | 'reduction';
  /** V */
  declare value: number;
  declare reference: string;
  declare solvent: string;
  declare electrolyte: CreationOptional<string | null>;
  /** half-wave: reversible E1/2; half-peak: Ep/2; peak: Ep of an irreversible wave */
  declare kind: 'half-wave' | 'half-peak' | 'peak';

  static initModel(sequelize: Sequelize): void {
    RedoxPotential.init(
      {
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
