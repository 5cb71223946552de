import type { Sequelize } from 'sequelize';
import { Lab } from './lab.model';

/** Binds every model to one Sequelize instance; call once per instance before use. */
export function initModels(sequelize: Sequelize): void {
  Lab.initModel(sequelize);
}

export { Lab };
