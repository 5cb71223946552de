import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * A study may hold several titration runs of one pair: each point names its run (series 1, 2, …),
 * and every run is normalised by its own I0 when the fit pools them. Existing points are run 1.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('study_points', 'series', {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 1,
  });
  await queryInterface.sequelize.query(
    'ALTER TABLE study_points ADD CONSTRAINT study_points_series_positive CHECK (series >= 1)',
  );
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeColumn('study_points', 'series');
};
