import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * An address is unique within an operator instead of across all of them, so that inviting an
 * address that already signs in elsewhere creates the same pending person as inviting a new one
 * (issue 12, finding 10: the answer must not tell an administrator that the address exists at
 * another operator). At most one person per address has a password; accepting an invitation
 * checks that (`server/auth/invitations.service.ts`).
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('ALTER TABLE users DROP INDEX email, ADD UNIQUE KEY users_operator_email (operator_id, email), ADD KEY users_email (email)', {
    type: QueryTypes.UPDATE,
  });
};

export const down: Migration = async ({ context: queryInterface }) => {
  // Invitations to an address that signs in at another operator cannot survive the global index.
  await queryInterface.sequelize.query(
    'DELETE pending FROM users pending JOIN users other ON other.email = pending.email AND other.id <> pending.id WHERE pending.password_hash IS NULL',
    { type: QueryTypes.DELETE },
  );
  await queryInterface.sequelize.query('ALTER TABLE users DROP INDEX users_operator_email, DROP INDEX users_email, ADD UNIQUE KEY email (email)', {
    type: QueryTypes.UPDATE,
  });
};
