import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Reaction scenarios: a real reaction's emitter, solvent, tau0 and components at their
 * concentrations, for the estimate of who intercepts the excited catalyst (shared/engine/README.md, section 8).
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('reaction_scenarios', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(160), allowNull: false },
    emitter_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'compounds', key: 'id' },
      onDelete: 'RESTRICT',
    },
    solvent: { type: DataTypes.STRING(80), allowNull: false },
    tau0: { type: DataTypes.DOUBLE, allowNull: false },
    tau0_source: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
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
  });
  await queryInterface.addIndex('reaction_scenarios', ['lab_id', 'updated_at']);
  await queryInterface.createTable('scenario_components', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    scenario_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'reaction_scenarios', key: 'id' },
      onDelete: 'CASCADE',
    },
    position: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.ENUM('compound', 'oxygen'), allowNull: false },
    compound_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'compounds', key: 'id' },
      onDelete: 'RESTRICT',
    },
    concentration: { type: DataTypes.DOUBLE, allowNull: false },
    study_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'studies', key: 'id' },
      onDelete: 'SET NULL',
    },
    manual_kq: { type: DataTypes.DOUBLE, allowNull: true },
    manual_kq_source: { type: DataTypes.TEXT, allowNull: true },
  });
  await queryInterface.addIndex('scenario_components', ['scenario_id', 'position']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('scenario_components');
  await queryInterface.dropTable('reaction_scenarios');
  await queryInterface.sequelize.query('DROP TYPE IF EXISTS enum_scenario_components_kind');
};
