import { DataTypes, Model } from 'sequelize';
import type {
  CreationOptional,
  ForeignKey,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize';
import type { Compound } from './compound.model';
import type { Lab } from './lab.model';
import type { ScenarioComponent } from './scenario-component.model';
import type { User } from './user.model';

/** A real reaction: emitter, solvent, tau0 (s) and the components at their concentrations. */
export class ReactionScenario extends Model<
  InferAttributes<ReactionScenario>,
  InferCreationAttributes<ReactionScenario>
> {
  declare id: CreationOptional<string>;
  declare labId: ForeignKey<Lab['id']>;
  declare name: string;
  declare emitterId: ForeignKey<Compound['id']>;
  declare solvent: string;
  /** s */
  declare tau0: number;
  declare tau0Source: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare emitter?: NonAttribute<Compound>;
  declare components?: NonAttribute<ScenarioComponent[]>;

  static initModel(sequelize: Sequelize): void {
    ReactionScenario.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(160), allowNull: false },
        solvent: { type: DataTypes.STRING(80), allowNull: false },
        tau0: { type: DataTypes.DOUBLE, allowNull: false },
        tau0Source: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'reaction_scenarios', version: true },
    );
  }
}
