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
 * Mechanism evidence from spectra. A mechanism file is kept byte for byte like a study upload
 * (in PostgreSQL or object storage, with its SHA-256); a spectrum matrix is one such file read
 * as emission spectra at several quencher concentrations of a study, with the band width it was
 * analysed at, the analysis (K_SV per band, χ² homogeneity, spectral components, flags) and the
 * spectra thinned for the plot.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('mechanism_files', {
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
    `ALTER TABLE mechanism_files ADD CONSTRAINT mechanism_files_storage_check CHECK (
       (storage = 'database' AND content IS NOT NULL) OR (storage = 's3' AND storage_key IS NOT NULL AND content IS NULL))`,
  );
  // Text matrices compress well; lz4 as for study uploads (migration 0009) where the server has it.
  await queryInterface.sequelize.query(
    `DO $$ BEGIN IF EXISTS (SELECT 1 FROM pg_settings WHERE name = 'default_toast_compression' AND 'lz4' = ANY (enumvals))
     THEN ALTER TABLE mechanism_files ALTER COLUMN content SET COMPRESSION lz4; END IF; END $$`,
  );
  await queryInterface.createTable('spectrum_matrices', {
    id,
    lab_id: labId,
    study_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'studies', key: 'id' },
      onDelete: 'CASCADE',
    },
    file_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'mechanism_files', key: 'id' },
      onDelete: 'RESTRICT',
    },
    title: { type: DataTypes.STRING(255), allowNull: false },
    band_width: { type: DataTypes.DOUBLE, allowNull: false },
    reading: { type: DataTypes.JSONB, allowNull: false },
    analysis: { type: DataTypes.JSONB, allowNull: false },
    plot: { type: DataTypes.JSONB, allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    created_by_id: userRef,
    ...timestamps,
  });
  await queryInterface.addIndex('spectrum_matrices', ['study_id', 'created_at']);
  await queryInterface.addIndex('spectrum_matrices', ['file_id']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('spectrum_matrices');
  await queryInterface.dropTable('mechanism_files');
};
