import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

const ROLES = ['pilot', 'engineer', 'approver', 'admin', 'inspector'];

export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('operators', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'operators', key: 'id' },
      onDelete: 'RESTRICT',
    },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(200), allowNull: false },
    role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: true },
    failed_sign_ins: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    locked_until: { type: DataTypes.DATE, allowNull: true },
    locked_by_admin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('users', ['operator_id']);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('users');
  await queryInterface.dropTable('operators');
};
