import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * The charge number of each compound before electron transfer, for the optional Coulomb work
 * term of the driving force (IUPAC Gold Book GT07388: charges of products minus reactants).
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('compounds', 'charge', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  // The driving force and the excited-state potentials read one couple of one compound at a time.
  await queryInterface.addIndex('redox_potentials', ['compound_id', 'couple']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeIndex('redox_potentials', ['compound_id', 'couple']);
  await queryInterface.removeColumn('compounds', 'charge');
};
