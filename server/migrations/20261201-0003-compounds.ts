import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/** The lab's compound library: emitters (photocatalysts) and quenchers. */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('compounds', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(160), allowNull: false },
    role_hint: { type: DataTypes.ENUM('photocatalyst', 'quencher', 'both'), allowNull: false },
    smiles: { type: DataTypes.TEXT, allowNull: true },
    formula: { type: DataTypes.STRING(120), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    /** The trade's label for the emissive state: MLCT, pi,pi*, n,pi*, charge transfer, ... */
    emissive_state: { type: DataTypes.STRING(60), allowNull: true },
    /** Triplet energy in eV, with where it came from. */
    triplet_energy: { type: DataTypes.DOUBLE, allowNull: true },
    triplet_energy_source: { type: DataTypes.TEXT, allowNull: true },
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
  // One name per lab, whatever the capitalisation.
  await queryInterface.sequelize.query(
    'CREATE UNIQUE INDEX compounds_lab_name_unique ON compounds (lab_id, lower(name))',
  );
  await queryInterface.addIndex('compounds', ['lab_id', 'role_hint']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('compounds');
  await queryInterface.sequelize.query('DROP TYPE IF EXISTS enum_compounds_role_hint');
};
