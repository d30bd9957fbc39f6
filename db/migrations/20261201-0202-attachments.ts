import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The source pages of a revision (flight-manual extracts as PDF or image). The file itself
 * lives under ATTACHMENTS_DIR/<operator id>/<storage name>; the row keeps what it was called,
 * what it is, its size and SHA-256, and who uploaded it.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'operators', key: 'id' }, onDelete: 'RESTRICT' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'revisions', key: 'id' }, onDelete: 'RESTRICT' },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_name: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    uploaded_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('attachments', ['revision_id']);
  await queryInterface.addIndex('attachments', ['operator_id']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('attachments');
};
