import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The card log read by airframe (`GET /api/card-issues?airframeId=…`, newest first, a page at a
 * time): an index on (operator, airframe, issue time) lets the page be read backwards along the
 * index and stop after one page, where (operator, airframe) alone made MariaDB merge two indexes
 * and sort every entry of the airframe (issue 15 part 5, `npm run bench:scale`). It replaces the
 * (operator, airframe) index, which is its prefix. InnoDB, one ALTER: no table rebuild, the same
 * on every Galera node.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    'ALTER TABLE card_issues ADD INDEX card_issues_operator_id_airframe_id_issued_at (operator_id, airframe_id, issued_at), DROP INDEX card_issues_operator_id_airframe_id',
    { type: QueryTypes.UPDATE },
  );
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(
    'ALTER TABLE card_issues ADD INDEX card_issues_operator_id_airframe_id (operator_id, airframe_id), DROP INDEX card_issues_operator_id_airframe_id_issued_at',
    { type: QueryTypes.UPDATE },
  );
};
