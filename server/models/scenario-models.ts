import type { Sequelize } from 'sequelize';
import { Compound } from './compound.model';
import { Lab } from './lab.model';
import { ReactionScenario } from './reaction-scenario.model';
import { ScenarioComponent } from './scenario-component.model';
import { User } from './user.model';

/** Reaction scenarios and their components; called from initModels after the compounds. */
export function initScenarioModels(sequelize: Sequelize): void {
  ReactionScenario.initModel(sequelize);
  ScenarioComponent.initModel(sequelize);
  ReactionScenario.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  ReactionScenario.belongsTo(Compound, { as: 'emitter', foreignKey: 'emitterId' });
  ReactionScenario.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  ReactionScenario.hasMany(ScenarioComponent, { as: 'components', foreignKey: 'scenarioId' });
  ScenarioComponent.belongsTo(ReactionScenario, { as: 'scenario', foreignKey: 'scenarioId' });
  ScenarioComponent.belongsTo(Compound, { as: 'compound', foreignKey: 'compoundId' });
}

export { ReactionScenario, ScenarioComponent };
