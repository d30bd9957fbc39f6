import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Sessions live in MariaDB (connect-session-sequelize's columns) so any server instance can
 * serve any request; login rate-limit counters live here for the same reason.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('sessions', ['expires']);
  await queryInterface.createTable('rate_limit_hits', {
    key: { type: DataTypes.STRING(191), primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    reset_at: { type: DataTypes.DATE(3), allowNull: false },
  });
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('rate_limit_hits');
  await queryInterface.dropTable('sessions');
};
