import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The audit trail: who did what to which record, when and from where. Append-only — the
 * application has no update or delete path for these rows (see server/audit/audit.service.ts).
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'operators', key: 'id' },
      onDelete: 'RESTRICT',
    },
    actor_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity_type: { type: DataTypes.STRING(64), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    details: { type: DataTypes.TEXT('long'), allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    user_agent: { type: DataTypes.STRING(500), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await queryInterface.addIndex('audit_events', ['operator_id', 'id']);
  await queryInterface.addIndex('audit_events', ['operator_id', 'entity_type', 'entity_id']);
  await queryInterface.addIndex('audit_events', ['operator_id', 'actor_id']);
  await queryInterface.addIndex('audit_events', ['operator_id', 'created_at']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('audit_events');
};
