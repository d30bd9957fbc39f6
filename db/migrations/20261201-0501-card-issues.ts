import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The card log: one row per speed card a pilot issued, as the device reported it (the id is the
 * device's random UUID, which makes reporting idempotent). Append-only. `entry_sha256` is the
 * hash of the reported entry, so a replay with the same id can be told from a different entry.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('card_issues', {
    id: { type: DataTypes.CHAR(36), allowNull: false, primaryKey: true },
    operator_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'operators', key: 'id' }, onDelete: 'RESTRICT' },
    issued_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    airframe_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'airframes', key: 'id' }, onDelete: 'RESTRICT' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'revisions', key: 'id' }, onDelete: 'RESTRICT' },
    inputs: { type: DataTypes.TEXT, allowNull: false },
    digest: { type: DataTypes.CHAR(64), allowNull: false },
    entry_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    issued_at: { type: DataTypes.DATE(3), allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('card_issues', ['operator_id', 'issued_at']);
  await queryInterface.addIndex('card_issues', ['operator_id', 'issued_by_id', 'issued_at']);
  await queryInterface.addIndex('card_issues', ['operator_id', 'airframe_id']);
  await queryInterface.addIndex('card_issues', ['operator_id', 'revision_id']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('card_issues');
};
