import type { MigrationModule } from '../db/migrator';

/**
 * Numbered pages far down the studies list (server/services/studies/study-list.service.ts) skip
 * their (page - 1) x pageSize rows by id first. The default order is updated_at DESC with id as the
 * tie-breaker; with id in the index, the rows skipped are read from the index alone (an index-only
 * scan) instead of from the table, and the order needs no sort. This index covers every use of
 * (lab_id, updated_at DESC) of migration 0005, which it replaces (one index more on every write
 * otherwise).
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    'CREATE INDEX studies_lab_updated_at_id ON studies (lab_id, updated_at DESC, id) WHERE is_current',
  );
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS studies_lab_id_updated_at');
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    'CREATE INDEX studies_lab_id_updated_at ON studies (lab_id, updated_at DESC) WHERE is_current',
  );
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS studies_lab_updated_at_id');
};
