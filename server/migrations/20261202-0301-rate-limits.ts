import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Attempt counters shared by every instance and kept across restarts (rate-limiter-flexible's
 * PostgreSQL store: key, points used, expiry in ms since the epoch).
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('rate_limits', {
    key: { type: DataTypes.STRING(255), primaryKey: true },
    points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    expire: { type: DataTypes.BIGINT, allowNull: true },
  });
  await queryInterface.addIndex('rate_limits', ['expire'], { name: 'rate_limits_expire' });
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('rate_limits');
};
