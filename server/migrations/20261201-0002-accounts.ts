import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const roleType = DataTypes.ENUM('viewer', 'researcher', 'reviewer', 'admin');

/** People, their lab memberships, invitations, password resets, sessions, caught mail and the audit log. */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await queryInterface.createTable('memberships', {
    id,
    lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: roleType, allowNull: false },
    ...timestamps,
  });
  await queryInterface.addIndex('memberships', ['lab_id', 'user_id'], { unique: true });
  await queryInterface.addIndex('memberships', ['user_id']);

  await queryInterface.createTable('invitations', {
    id,
    lab_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: roleType, allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' } },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await queryInterface.addIndex('invitations', ['lab_id', 'email']);

  await queryInterface.createTable('password_resets', {
    id,
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });

  // The table connect-pg-simple expects for express-session.
  await queryInterface.createTable('sessions', {
    sid: { type: DataTypes.STRING, primaryKey: true },
    sess: { type: DataTypes.JSON, allowNull: false },
    expire: { type: DataTypes.DATE(6), allowNull: false },
  });
  await queryInterface.addIndex('sessions', ['expire']);

  await queryInterface.createTable('caught_mail', {
    id,
    lab_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'labs', key: 'id' }, onDelete: 'SET NULL' },
    from_address: { type: DataTypes.TEXT, allowNull: false },
    to_addresses: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    raw: { type: DataTypes.TEXT, allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('caught_mail', ['received_at']);

  await queryInterface.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    lab_id: { type: DataTypes.UUID, allowNull: true },
    actor_id: { type: DataTypes.UUID, allowNull: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    target_type: { type: DataTypes.STRING(40), allowNull: true },
    target_id: { type: DataTypes.STRING(80), allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ip_address: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await queryInterface.addIndex('audit_events', ['lab_id', 'created_at']);
  // Append-only: the database itself refuses to change or delete audit rows.
  await queryInterface.sequelize.query(`
    CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'audit_events is append-only'; END $$;
    CREATE TRIGGER audit_events_no_change BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only();
  `);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('audit_events');
  await queryInterface.sequelize.query('DROP FUNCTION IF EXISTS audit_events_append_only()');
  for (const table of ['caught_mail', 'sessions', 'password_resets', 'invitations', 'memberships', 'users']) {
    await queryInterface.dropTable(table);
  }
  await queryInterface.sequelize.query(
    'DROP TYPE IF EXISTS enum_memberships_role; DROP TYPE IF EXISTS enum_invitations_role;',
  );
};
