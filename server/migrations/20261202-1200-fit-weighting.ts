import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * The fit's weighting becomes a choice: studies keep the chosen one (unweighted unless chosen), and
 * each fit records the one it was made with (null for fits made before the choice). Until now a
 * single-run study whose every point had an uncertainty was weighted without being asked, so those
 * studies start as "weighted" and their numbers do not change at the next fit.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('studies', 'fit_weighting', {
    type: DataTypes.STRING(20),
    allowNull: false,
    defaultValue: 'unweighted',
  });
  await queryInterface.sequelize.query(
    "ALTER TABLE studies ADD CONSTRAINT studies_fit_weighting_known CHECK (fit_weighting IN ('unweighted', 'weighted'))",
  );
  await queryInterface.addColumn('study_fits', 'weighting', { type: DataTypes.STRING(20), allowNull: true });
  await queryInterface.sequelize.query(`
    UPDATE studies s SET fit_weighting = 'weighted'
     WHERE EXISTS (SELECT 1 FROM study_points p WHERE p.study_id = s.id AND NOT p.excluded)
       AND NOT EXISTS (SELECT 1 FROM study_points p WHERE p.study_id = s.id AND NOT p.excluded AND p.uncertainty IS NULL)
       AND (SELECT count(DISTINCT p.series) FROM study_points p WHERE p.study_id = s.id AND NOT p.excluded) = 1`);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeColumn('study_fits', 'weighting');
  await queryInterface.removeColumn('studies', 'fit_weighting');
};
