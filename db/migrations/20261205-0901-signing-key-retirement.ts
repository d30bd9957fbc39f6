import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Signing-key rotation (issue 14, part 3): a key an administrator replaces is retired, never
 * deleted, so that the revisions it signed stay verifiable. `retired_at` says when; `active`
 * stays the flag publication reads (exactly one active key per operator after a rotation).
 * A key already inactive before this migration is dated by its last change.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('ALTER TABLE signing_keys ADD COLUMN retired_at DATETIME NULL AFTER active', { type: QueryTypes.UPDATE });
  await queryInterface.sequelize.query('UPDATE signing_keys SET retired_at = updated_at WHERE active = 0', { type: QueryTypes.UPDATE });
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('ALTER TABLE signing_keys DROP COLUMN retired_at', { type: QueryTypes.UPDATE });
};
