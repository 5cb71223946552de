import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Raw files may live in PostgreSQL (as before, the default) or in S3-compatible object
 * storage: each row says where its bytes are. A row in object storage keeps its key and no
 * content; a row in the database keeps its content. The check keeps every row readable.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('study_uploads', 'storage', {
    type: DataTypes.STRING(16),
    allowNull: false,
    defaultValue: 'database',
  });
  await queryInterface.addColumn('study_uploads', 'storage_key', { type: DataTypes.STRING(512), allowNull: true });
  // DROP NOT NULL alone: changeColumn would also restate the type (and could drop the lz4 setting of 0009).
  await queryInterface.sequelize.query('ALTER TABLE study_uploads ALTER COLUMN content DROP NOT NULL');
  await queryInterface.sequelize.query(
    `ALTER TABLE study_uploads ADD CONSTRAINT study_uploads_storage_check CHECK (
       (storage = 'database' AND content IS NOT NULL) OR (storage = 's3' AND storage_key IS NOT NULL AND content IS NULL))`,
  );
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  const [[{ moved }]] = (await queryInterface.sequelize.query(
    "SELECT count(*)::int AS moved FROM study_uploads WHERE storage <> 'database'",
  )) as unknown as [[{ moved: number }]];
  if (moved > 0)
    throw new Error(`${moved} uploads live in object storage; move them back into the database before going back.`);
  await queryInterface.sequelize.query('ALTER TABLE study_uploads DROP CONSTRAINT study_uploads_storage_check');
  await queryInterface.sequelize.query('ALTER TABLE study_uploads ALTER COLUMN content SET NOT NULL');
  await queryInterface.removeColumn('study_uploads', 'storage_key');
  await queryInterface.removeColumn('study_uploads', 'storage');
};
