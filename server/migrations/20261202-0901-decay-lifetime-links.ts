import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

const decaySetRef = {
  type: DataTypes.UUID,
  allowNull: true,
  references: { model: 'decay_sets', key: 'id' },
  onDelete: 'SET NULL',
};

/**
 * Lifetimes that come from fitted decays say so: a point's lifetime keeps its standard error
 * and the decay set it came from, a study's tau0 the set of its zero-concentration decay.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('study_points', 'lifetime_uncertainty', { type: DataTypes.DOUBLE, allowNull: true });
  await queryInterface.addColumn('study_points', 'lifetime_decay_set_id', decaySetRef);
  await queryInterface.addColumn('studies', 'tau0_decay_set_id', decaySetRef);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeColumn('studies', 'tau0_decay_set_id');
  await queryInterface.removeColumn('study_points', 'lifetime_decay_set_id');
  await queryInterface.removeColumn('study_points', 'lifetime_uncertainty');
};
