import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { Compound } from './compound.model';
import { measurementTrailAttributes } from './measurement-trail';
import type { Lab } from './lab.model';
import type { User } from './user.model';

/** E00 of an emitter in eV; `wavelength` (nm) is kept when the value was entered as a wavelength. */
export class ExcitedStateEnergy extends Model<
  InferAttributes<ExcitedStateEnergy>,
  InferCreationAttributes<ExcitedStateEnergy>
> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare compoundId: ForeignKey<Compound['id']>;
  /** eV */
  declare value: number;
  /** nm */
  declare wavelength: CreationOptional<number | null>;
  declare method: string;
  declare source: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ExcitedStateEnergy.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        value: { type: DataTypes.DOUBLE, allowNull: false },
        wavelength: { type: DataTypes.DOUBLE, allowNull: true },
        method: { type: DataTypes.STRING(120), allowNull: false },
        ...measurementTrailAttributes,
      },
      { sequelize, tableName: 'excited_state_energies', version: true },
    );
  }
}
