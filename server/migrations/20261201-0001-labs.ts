import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/** Labs are the tenant: every study, compound and file belongs to one lab. */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('labs', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    name: { type: DataTypes.STRING(160), allowNull: false },
    slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('labs');
};
