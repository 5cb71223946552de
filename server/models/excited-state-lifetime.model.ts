import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { Compound } from './compound.model';
import { measurementTrailAttributes } from './measurement-trail';
import type { Lab } from './lab.model';
import type { User } from './user.model';

export const atmospheres = ['argon', 'nitrogen', 'air', 'oxygen', 'vacuum', 'other'] as const;
export type Atmosphere = (typeof atmospheres)[number];

/** An unquenched excited-state lifetime of an emitter (seconds), with its conditions. */
export class ExcitedStateLifetime extends Model<
  InferAttributes<ExcitedStateLifetime>,
  InferCreationAttributes<ExcitedStateLifetime>
> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare compoundId: ForeignKey<Compound['id']>;
  /** s */
  declare value: number;
  /** s (one standard uncertainty) */
  declare uncertainty: CreationOptional<number | null>;
  declare solvent: string;
  declare atmosphere: Atmosphere;
  /** K */
  declare temperature: CreationOptional<number>;
  declare method: string;
  declare source: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ExcitedStateLifetime.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
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
