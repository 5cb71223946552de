import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { Compound } from './compound.model';
import type { ScenarioComponent } from './scenario-component.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

/** A real reaction: emitter, solvent, tau0 (s) and the components at their concentrations. */
export class ReactionScenario extends LabRecord<ReactionScenario> {
  declare name: string;
  declare emitterId: ForeignKey<Compound['id']>;
  declare solvent: string;
  /** s */
  declare tau0: number;
  declare tau0Source: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare createdById: ForeignKey<User['id']> | null;
  declare version: CreationOptional<number>;
  declare emitter?: NonAttribute<Compound>;
  declare components?: NonAttribute<ScenarioComponent[]>;

  static initModel(sequelize: Sequelize): void {
    ReactionScenario.init(
      {
        ...recordColumns(),
        name: { type: DataTypes.STRING(160), allowNull: false },
        solvent: { type: DataTypes.STRING(80), allowNull: false },
        tau0: { type: DataTypes.DOUBLE, allowNull: false },
        tau0Source: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'reaction_scenarios', version: true },
    );
  }
}
