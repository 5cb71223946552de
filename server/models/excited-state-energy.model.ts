import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { MeasurementModel, measurementTrailAttributes } from './measurement-trail';

/** E00 of an emitter in eV; `wavelength` (nm) is kept when the value was entered as a wavelength. */
export class ExcitedStateEnergy extends MeasurementModel<ExcitedStateEnergy> {
  /** eV */
  declare value: number;
  /** nm */
  declare wavelength: CreationOptional<number | null>;
  declare method: string;

  static initModel(sequelize: Sequelize): void {
    ExcitedStateEnergy.init(
      {
        value: { type: DataTypes.DOUBLE, allowNull: false },
        wavelength: { type: DataTypes.DOUBLE, allowNull: true },
        method: { type: DataTypes.STRING(120), allowNull: false },
        ...measurementTrailAttributes,
      },
      { sequelize, tableName: 'excited_state_energies', version: true },
    );
  }
}
