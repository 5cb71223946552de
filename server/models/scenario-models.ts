import type { Sequelize } from 'sequelize';
import { belongsToEach } from './associations';
import { Compound } from './compound.model';
import { Lab } from './lab.model';
import { ReactionScenario } from './reaction-scenario.model';
import { ScenarioComponent } from './scenario-component.model';
import { User } from './user.model';

/** Reaction scenarios and their components; called from initModels after the compounds. */
export function initScenarioModels(sequelize: Sequelize): void {
  ReactionScenario.initModel(sequelize);
  ScenarioComponent.initModel(sequelize);
  belongsToEach(ReactionScenario, { lab: Lab, emitter: Compound, createdBy: User });
  belongsToEach(ScenarioComponent, { scenario: ReactionScenario, compound: Compound });
  ReactionScenario.hasMany(ScenarioComponent, { as: 'components', foreignKey: 'scenarioId' });
}

export { ReactionScenario, ScenarioComponent };
