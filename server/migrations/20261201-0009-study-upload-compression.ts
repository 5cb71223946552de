import type { MigrationModule } from '../db/migrator';

/**
 * Raw uploads (up to 20 MB of instrument text) were compressed with PostgreSQL's default pglz
 * when stored, which took most of the time of keeping a 10 MB file (`npm run bench:ingest`).
 * lz4 (PostgreSQL 14 and later, when the server was built with it) stores and reads them several
 * times faster and still compresses text. Only new values use it; a server without lz4 keeps pglz.
 */
const hasLz4 = "SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY (enumvals)";

export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    `DO $$ BEGIN IF EXISTS (${hasLz4}) THEN ALTER TABLE study_uploads ALTER COLUMN content SET COMPRESSION lz4; END IF; END $$`,
  );
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    `DO $$ BEGIN IF EXISTS (${hasLz4}) THEN ALTER TABLE study_uploads ALTER COLUMN content SET COMPRESSION pglz; END IF; END $$`,
  );
};
