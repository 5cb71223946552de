import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Absorption titrations live with the spectrum matrices: the same shape of file (wavelength and
 * one spectrum per [Q]) kept the same way, told apart by `kind` ('emission' for every row kept
 * before). An absorption titration adds the options it was analysed with (band width, path
 * length, the emitter's concentration) and, when given, the quencher's own spectrum as a second
 * kept file.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('spectrum_matrices', 'kind', {
    type: DataTypes.STRING(16),
    allowNull: false,
    defaultValue: 'emission',
  });
  await queryInterface.sequelize.query(
    `ALTER TABLE spectrum_matrices ADD CONSTRAINT spectrum_matrices_kind_check CHECK (kind IN ('emission', 'absorption'))`,
  );
  await queryInterface.addColumn('spectrum_matrices', 'options', { type: DataTypes.JSONB, allowNull: true });
  await queryInterface.addColumn('spectrum_matrices', 'quencher_file_id', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'mechanism_files', key: 'id' },
    onDelete: 'RESTRICT',
  });
  await queryInterface.addIndex('spectrum_matrices', ['study_id', 'kind', 'created_at']);
  await queryInterface.addIndex('spectrum_matrices', ['quencher_file_id']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`DELETE FROM spectrum_matrices WHERE kind = 'absorption'`);
  await queryInterface.removeColumn('spectrum_matrices', 'quencher_file_id');
  await queryInterface.removeColumn('spectrum_matrices', 'options');
  await queryInterface.removeColumn('spectrum_matrices', 'kind');
};
