import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { MeasurementModel, measurementTrailAttributes } from './measurement-trail';

export const atmospheres = ['argon', 'nitrogen', 'air', 'oxygen', 'vacuum', 'other'] as const;
export type Atmosphere = (typeof atmospheres)[number];

/** An unquenched excited-state lifetime of an emitter (seconds), with its conditions. */
export class ExcitedStateLifetime extends MeasurementModel<ExcitedStateLifetime> {
  /** s */
  declare value: number;
  /** s (one standard uncertainty) */
  declare uncertainty: CreationOptional<number | null>;
  declare solvent: string;
  declare atmosphere: Atmosphere;
  /** K */
  declare temperature: CreationOptional<number>;
  declare method: string;

  static initModel(sequelize: Sequelize): void {
    ExcitedStateLifetime.init(
      {
        value: { type: DataTypes.DOUBLE, allowNull: false },
        uncertainty: { type: DataTypes.DOUBLE, allowNull: true },
        solvent: { type: DataTypes.STRING(80), allowNull: false },
        atmosphere: { type: DataTypes.ENUM(...atmospheres), allowNull: false },
        temperature: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 298.15 },
        method: { type: DataTypes.STRING(120), allowNull: false },
        ...measurementTrailAttributes,
      },
      { sequelize, tableName: 'excited_state_lifetimes', version: true },
    );
  }
}
