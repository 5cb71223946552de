import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Optional two-step sign-in with a time-based code (TOTP, RFC 6238): the person's secret, when it
 * was turned on, the last time step used (no code works twice), hashed single-use recovery codes,
 * and a lab rule that its admins and reviewers must use it.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('users', 'totp_secret', { type: DataTypes.STRING(64), allowNull: true });
  await queryInterface.addColumn('users', 'totp_enabled_at', { type: DataTypes.DATE, allowNull: true });
  await queryInterface.addColumn('users', 'totp_last_step', { type: DataTypes.BIGINT, allowNull: true });
  await queryInterface.addColumn('labs', 'require_two_factor', {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });
  await queryInterface.createTable('recovery_codes', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    code_hash: { type: DataTypes.STRING(64), allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('recovery_codes', ['user_id', 'code_hash'], { name: 'recovery_codes_user_code' });
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('recovery_codes');
  await queryInterface.removeColumn('labs', 'require_two_factor');
  for (const column of ['totp_last_step', 'totp_enabled_at', 'totp_secret']) {
    await queryInterface.removeColumn('users', column);
  }
};
