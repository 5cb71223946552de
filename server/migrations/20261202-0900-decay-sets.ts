import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const labId = { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' };
const userRef = {
  type: DataTypes.UUID,
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
};
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * Decay histograms and their fits. A decay file is kept byte for byte like a study upload (in
 * PostgreSQL or object storage, with its SHA-256); a decay set is one decay file (with its
 * response file, if separate) read and fitted as chosen, attached to a study or to an emitter
 * of the library. The fit of every decay is kept with the exact parameters, so curves can be
 * drawn again and the lifetimes traced to the file.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('decay_files', {
    id,
    lab_id: labId,
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    media_type: { type: DataTypes.STRING(120), allowNull: false },
    size: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    storage: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'database' },
    storage_key: { type: DataTypes.STRING(512), allowNull: true },
    content: { type: DataTypes.BLOB, allowNull: true },
    uploaded_by_id: userRef,
    ...timestamps,
  });
  await queryInterface.sequelize.query(
    `ALTER TABLE decay_files ADD CONSTRAINT decay_files_storage_check CHECK (
       (storage = 'database' AND content IS NOT NULL) OR (storage = 's3' AND storage_key IS NOT NULL AND content IS NULL))`,
  );
  // Text histograms compress well; lz4 as for study uploads (migration 0009) where the server has it.
  await queryInterface.sequelize.query(
    `DO $$ BEGIN IF EXISTS (SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY (enumvals))
     THEN ALTER TABLE decay_files ALTER COLUMN content SET COMPRESSION lz4; END IF; END $$`,
  );
  const fileRef = (allowNull: boolean) => ({
    type: DataTypes.UUID,
    allowNull,
    references: { model: 'decay_files', key: 'id' },
    onDelete: 'RESTRICT',
  });
  await queryInterface.createTable('decay_sets', {
    id,
    lab_id: labId,
    study_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'studies', key: 'id' },
      onDelete: 'CASCADE',
    },
    compound_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'compounds', key: 'id' },
      onDelete: 'CASCADE',
    },
    lifetime_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'excited_state_lifetimes', key: 'id' },
      onDelete: 'SET NULL',
    },
    title: { type: DataTypes.STRING(255), allowNull: false },
    file_id: fileRef(false),
    response_file_id: fileRef(true),
    reading: { type: DataTypes.JSONB, allowNull: false },
    options: { type: DataTypes.JSONB, allowNull: false },
    outcomes: { type: DataTypes.JSONB, allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    created_by_id: userRef,
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await queryInterface.addIndex('decay_sets', ['study_id']);
  await queryInterface.addIndex('decay_sets', ['compound_id']);
  await queryInterface.addIndex('decay_sets', ['file_id']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('decay_sets');
  await queryInterface.dropTable('decay_files');
};
