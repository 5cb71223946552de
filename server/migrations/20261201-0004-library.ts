import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

const common = {
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
  lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' },
  compound_id: {
    type: DataTypes.UUID,
    allowNull: false,
    references: { model: 'compounds', key: 'id' },
    onDelete: 'CASCADE',
  },
};
const trail = {
  source: { type: DataTypes.TEXT, allowNull: true },
  notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
  created_by_id: {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'users', key: 'id' },
    onDelete: 'SET NULL',
  },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * Per-compound measurements: ground-state redox potentials (kept as entered, with their
 * reference electrode), excited-state lifetimes and E00 values; and each lab's display reference.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('redox_potentials', {
    ...common,
    couple: { type: DataTypes.ENUM('oxidation', 'reduction'), allowNull: false },
    value: { type: DataTypes.DOUBLE, allowNull: false },
    reference: { type: DataTypes.STRING(40), allowNull: false },
    solvent: { type: DataTypes.STRING(80), allowNull: false },
    electrolyte: { type: DataTypes.STRING(120), allowNull: true },
    kind: { type: DataTypes.ENUM('half-wave', 'half-peak', 'peak'), allowNull: false },
    ...trail,
  });
  await queryInterface.addIndex('redox_potentials', ['lab_id', 'compound_id']);

  await queryInterface.createTable('excited_state_lifetimes', {
    ...common,
    value: { type: DataTypes.DOUBLE, allowNull: false },
    uncertainty: { type: DataTypes.DOUBLE, allowNull: true },
    solvent: { type: DataTypes.STRING(80), allowNull: false },
    atmosphere: { type: DataTypes.ENUM('argon', 'nitrogen', 'air', 'oxygen', 'vacuum', 'other'), allowNull: false },
    temperature: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 298.15 },
    method: { type: DataTypes.STRING(120), allowNull: false },
    ...trail,
  });
  await queryInterface.addIndex('excited_state_lifetimes', ['lab_id', 'compound_id']);

  await queryInterface.createTable('excited_state_energies', {
    ...common,
    value: { type: DataTypes.DOUBLE, allowNull: false },
    wavelength: { type: DataTypes.DOUBLE, allowNull: true },
    method: { type: DataTypes.STRING(120), allowNull: false },
    ...trail,
  });
  await queryInterface.addIndex('excited_state_energies', ['lab_id', 'compound_id']);

  await queryInterface.addColumn('labs', 'display_reference', {
    type: DataTypes.STRING(40),
    allowNull: false,
    defaultValue: 'SCE',
  });
  await queryInterface.addColumn('labs', 'display_solvent', {
    type: DataTypes.STRING(80),
    allowNull: false,
    defaultValue: 'acetonitrile',
  });
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeColumn('labs', 'display_solvent');
  await queryInterface.removeColumn('labs', 'display_reference');
  for (const table of ['excited_state_energies', 'excited_state_lifetimes', 'redox_potentials']) {
    await queryInterface.dropTable(table);
  }
  await queryInterface.sequelize.query(
    'DROP TYPE IF EXISTS enum_redox_potentials_couple; DROP TYPE IF EXISTS enum_redox_potentials_kind; ' +
      'DROP TYPE IF EXISTS enum_excited_state_lifetimes_atmosphere;',
  );
};
