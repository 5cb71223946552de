import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

/**
 * Caught mail is shown to its addressee (and an invitation to the admin who sent it), so each
 * message records its kind and sender; the addressee lookup gets an index.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('caught_mail', 'kind', { type: DataTypes.STRING(40), allowNull: true });
  await queryInterface.addColumn('caught_mail', 'sender_id', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'users', key: 'id' },
    onDelete: 'SET NULL',
  });
  await queryInterface.addIndex('caught_mail', ['to_addresses'], { using: 'gin', name: 'caught_mail_to_addresses' });
  await queryInterface.addIndex('caught_mail', ['sender_id'], { name: 'caught_mail_sender' });
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  await queryInterface.removeIndex('caught_mail', 'caught_mail_sender');
  await queryInterface.removeIndex('caught_mail', 'caught_mail_to_addresses');
  await queryInterface.removeColumn('caught_mail', 'sender_id');
  await queryInterface.removeColumn('caught_mail', 'kind');
};
