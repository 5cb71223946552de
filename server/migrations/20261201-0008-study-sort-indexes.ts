import type { MigrationModule } from '../db/migrator';

/**
 * The studies list sorts by kq or K_SV with NULLS LAST and breaks ties by id
 * (server/services/studies/study-list.service.ts). The plain (lab_id, kq) and (lab_id, k_sv)
 * indexes of migration 0005 match neither direction once the tie-breaker is added, so
 * PostgreSQL read every current study of the lab and sorted them. One index per direction lets
 * it walk the index and stop after one page: ascending is ASC NULLS LAST, id (a plain btree
 * column), descending is DESC NULLS LAST, id (a backward scan would put the NULLs first).
 */
const SORTED = ['kq', 'k_sv'] as const;

export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  for (const column of SORTED) {
    // (lab_id, <column>, id) below covers every use of the old two-column index.
    await queryInterface.sequelize.query(`DROP INDEX IF EXISTS studies_lab_id_${column}`);
    await queryInterface.sequelize.query(
      `CREATE INDEX studies_lab_${column}_asc ON studies (lab_id, ${column} ASC NULLS LAST, id) WHERE is_current`,
    );
    await queryInterface.sequelize.query(
      `CREATE INDEX studies_lab_${column}_desc ON studies (lab_id, ${column} DESC NULLS LAST, id) WHERE is_current`,
    );
  }
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  for (const column of SORTED) {
    await queryInterface.sequelize.query(`DROP INDEX IF EXISTS studies_lab_${column}_asc`);
    await queryInterface.sequelize.query(`DROP INDEX IF EXISTS studies_lab_${column}_desc`);
    await queryInterface.sequelize.query(
      `CREATE INDEX studies_lab_id_${column} ON studies (lab_id, ${column}) WHERE is_current`,
    );
  }
};
