import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Invitations and password-reset links. Only the SHA-256 of each token is kept, so a copy of
 * the database does not hold usable links; a token is spent by setting `used_at`, and
 * `revoked_at` marks one replaced by a newer link.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('invitations', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'operators', key: 'id' }, onDelete: 'RESTRICT' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    invited_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('invitations', ['user_id']);
  await queryInterface.addIndex('invitations', ['operator_id']);

  await queryInterface.createTable('password_reset_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('password_reset_tokens', ['user_id', 'created_at']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('password_reset_tokens');
  await queryInterface.dropTable('invitations');
};
