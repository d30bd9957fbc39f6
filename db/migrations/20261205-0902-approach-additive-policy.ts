import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The operator's approach additive policy (issue 16): the fraction of the steady headwind and
 * of the gust increment added to VREF, and the least and most additive in kt. Existing
 * operators get the common practice (from memory): ½ headwind, the whole gust, 5 to 20 kt.
 * DOUBLE keeps the figure an administrator typed exactly as typed (a third stays a third).
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.addColumn('operators', 'approach_headwind_fraction', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.5 });
  await queryInterface.addColumn('operators', 'approach_gust_fraction', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 });
  await queryInterface.addColumn('operators', 'approach_additive_minimum_kt', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 5 });
  await queryInterface.addColumn('operators', 'approach_additive_maximum_kt', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 20 });
};

export const down: Migration = async ({ context: queryInterface }) => {
  // Plain ALTER TABLE: queryInterface.removeColumn first runs a RAW foreign-key lookup, which
  // meets the mariadb connector's `meta` problem (DEVELOPERS.md, pitfalls).
  await queryInterface.sequelize.query(
    'ALTER TABLE operators DROP COLUMN approach_headwind_fraction, DROP COLUMN approach_gust_fraction, DROP COLUMN approach_additive_minimum_kt, DROP COLUMN approach_additive_maximum_kt',
    { type: QueryTypes.UPDATE },
  );
};
