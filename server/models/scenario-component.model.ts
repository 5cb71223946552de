import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { Compound } from './compound.model';
import type { ReactionScenario } from './reaction-scenario.model';
import { KeyedRecord, keyColumns } from './record';

/** One component of a scenario at its concentration (mol/L); kq comes from a study or, for O2, by hand. */
export class ScenarioComponent extends KeyedRecord<ScenarioComponent> {
  declare scenarioId: ForeignKey<ReactionScenario['id']>;
  declare position: number;
  declare kind: 'compound' | 'oxygen';
  declare compoundId: ForeignKey<Compound['id']> | null;
  /** mol/L */
  declare concentration: number;
  /** the study chosen to supply kq; null means "pick the best available" */
  declare studyId: string | null;
  /** M^-1 s^-1, for dissolved oxygen when no study of it exists */
  declare manualKq: number | null;
  declare manualKqSource: string | null;
  declare compound?: NonAttribute<Compound | null>;

  static initModel(sequelize: Sequelize): void {
    ScenarioComponent.init(
      {
        ...keyColumns(),
        position: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.ENUM('compound', 'oxygen'), allowNull: false },
        concentration: { type: DataTypes.DOUBLE, allowNull: false },
        studyId: { type: DataTypes.UUID, allowNull: true },
        manualKq: { type: DataTypes.DOUBLE, allowNull: true },
        manualKqSource: { type: DataTypes.TEXT, allowNull: true },
      },
      { sequelize, tableName: 'scenario_components', timestamps: false },
    );
  }
}
