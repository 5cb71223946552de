import type { MigrationModule } from '../db/migrator';

/**
 * The studies of one emitter or one quencher, newest first with id as the tie-breaker: a
 * comparison takes the newest 500 (server/services/comparisons/comparison-rows.ts) and the studies
 * list filtered by either compound pages through them by number. With id at the end of the index
 * those ids come from the index alone in their order; without it PostgreSQL read every study of
 * the compound and sorted them (2,500 rows for 500 in the bench:studies big lab). These replace
 * the (lab_id, emitter_id | quencher_id, updated_at DESC) indexes of migration 0005 (same number
 * of indexes to keep on every write).
 */
const COLUMNS = ['emitter_id', 'quencher_id'] as const;

export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  for (const column of COLUMNS) {
    await queryInterface.sequelize.query(
      `CREATE INDEX studies_lab_${column}_updated_at_id ON studies (lab_id, ${column}, updated_at DESC, id) WHERE is_current`,
    );
    await queryInterface.sequelize.query(`DROP INDEX IF EXISTS studies_lab_id_${column}_updated_at`);
  }
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  for (const column of COLUMNS) {
    await queryInterface.sequelize.query(
      `CREATE INDEX studies_lab_id_${column}_updated_at ON studies (lab_id, ${column}, updated_at DESC) WHERE is_current`,
    );
    await queryInterface.sequelize.query(`DROP INDEX IF EXISTS studies_lab_${column}_updated_at_id`);
  }
};
