import { DataTypes, QueryTypes } from 'sequelize';
import { generateCardCode0701 as generateCardCode } from './frozen/card-code-0701';
import type { Migration } from '../migration';

/**
 * The card code of every card log entry (shared/card-check/card-code.ts; this migration uses
 * its own frozen copy, ./frozen/card-code-0701.ts): 9 characters, unique,
 * printed on the card and asked about at `GET /api/verify/:code`. Entries logged before this
 * migration get a code of their own here, so every entry has one.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  const sequelize = queryInterface.sequelize;
  // Not QueryTypes.RAW: Sequelize 6 then deletes the mariadb connector's non-configurable
  // `meta` and throws (DEVELOPERS.md, pitfalls); UPDATE only reads affectedRows.
  const sql = (text: string, replacements?: unknown[]) => sequelize.query(text, { type: QueryTypes.UPDATE, replacements });
  await queryInterface.addColumn('card_issues', 'code', { type: DataTypes.CHAR(9), allowNull: true });
  const rows = await sequelize.query<{ id: string }>('SELECT id FROM card_issues WHERE code IS NULL', { type: QueryTypes.SELECT });
  const taken = new Set<string>();
  for (const { id } of rows) {
    let code = generateCardCode();
    while (taken.has(code)) code = generateCardCode();
    taken.add(code);
    await sql('UPDATE card_issues SET code = ? WHERE id = ?', [code, id]);
  }
  await sql('ALTER TABLE card_issues MODIFY code CHAR(9) NOT NULL');
  await queryInterface.addIndex('card_issues', ['code'], { name: 'card_issues_code', unique: true });
};

export const down: Migration = async ({ context: queryInterface }) => {
  // Plain ALTER TABLE: queryInterface.removeColumn first runs a RAW foreign-key lookup, which
  // meets the connector `meta` problem (DEVELOPERS.md, pitfalls).
  await queryInterface.sequelize.query('ALTER TABLE card_issues DROP INDEX card_issues_code, DROP COLUMN code', { type: QueryTypes.UPDATE });
};
