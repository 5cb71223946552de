import type { MigrationModule } from '../db/migrator';

/**
 * Two indexes the dashboard (server/services/dashboard/dashboard.service.ts) lacked, so that each
 * of its statements enters an index at the lab's rows in the order it reads them and stops after
 * its LIMIT, whatever the lab holds; that also makes their plans the same for every lab, so they
 * can run as prepared statements with a kept plan.
 * - "Returned to me" and "my drafts" filter on owner and status together: (lab_id, status,
 *   updated_at) read every returned study of the lab and threw away the other owners' ones.
 * - The last 20 events of a lab (newest id first) walked the whole audit_events primary key
 *   backwards, reading every other lab's events until 20 of this lab's were found;
 *   (lab_id, created_at) orders by time, not by id.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    'CREATE INDEX studies_lab_owner_status ON studies (lab_id, owner_id, status, updated_at DESC) WHERE is_current',
  );
  await queryInterface.sequelize.query('CREATE INDEX audit_events_lab_id_id ON audit_events (lab_id, id)');
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS studies_lab_owner_status');
  await queryInterface.sequelize.query('DROP INDEX IF EXISTS audit_events_lab_id_id');
};
