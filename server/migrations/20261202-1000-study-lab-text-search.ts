import type { MigrationModule } from '../db/migrator';

/**
 * Text search in the studies list always asks within one lab. The trigram index of migration
 * 0005 covers every lab's studies, so with many labs PostgreSQL either read the whole lab or every
 * lab's matches before keeping this lab's. One GIN index over (lab_id, title || ' ' || notes)
 * answers both conditions at once (btree_gin gives GIN the uuid column; it ships with PostgreSQL
 * and is a trusted extension, like pg_trgm). It replaces the all-labs index, which nothing else uses.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('CREATE EXTENSION IF NOT EXISTS btree_gin');
  await queryInterface.sequelize.query(
    "CREATE INDEX studies_lab_text_search ON studies USING gin (lab_id, (title || ' ' || notes) gin_trgm_ops) WHERE is_current",
  );
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS studies_text_search');
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    "CREATE INDEX studies_text_search ON studies USING gin ((title || ' ' || notes) gin_trgm_ops)",
  );
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS studies_lab_text_search');
};
