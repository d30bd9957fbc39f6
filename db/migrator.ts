import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import type { Migration } from './migration';
import * as operatorsAndUsers from './migrations/20261201-0001-operators-and-users';
import * as sessionsAndRateLimits from './migrations/20261201-0002-sessions-and-rate-limits';
import * as auditEvents from './migrations/20261201-0101-audit-events';
import * as fleetSpeedBooksRevisions from './migrations/20261201-0102-fleet-speed-books-revisions';
import * as invitationsAndPasswordResets from './migrations/20261201-0201-invitations-and-password-resets';
import * as attachments from './migrations/20261201-0202-attachments';
import * as cardIssues from './migrations/20261201-0501-card-issues';
import * as syncChangesAndCurrencyLimit from './migrations/20261202-0601-sync-changes-and-currency-limit';
import * as cardIssueCodes from './migrations/20261202-0701-card-issue-codes';
import * as revisionContributors from './migrations/20261205-0801-revision-contributors';
import * as userAddressPerOperator from './migrations/20261205-0802-user-address-per-operator';
import * as signingKeyRetirement from './migrations/20261205-0901-signing-key-retirement';
import * as approachAdditivePolicy from './migrations/20261205-0902-approach-additive-policy';
import * as syncStampsAtCommit from './migrations/20261205-0903-sync-stamps-at-commit';
import * as cardLogAirframeTimeIndex from './migrations/20261205-1001-card-log-airframe-time-index';


/**
 * Migrations in order. Listed by hand rather than globbed so that the same list works under
 * tsx, ts-jest and a compiled build. A new migration: add a file under db/migrations/ with
 * `up` and `down`, then one line here.
 */
const MIGRATIONS: { name: string; module: { up: Migration; down: Migration } }[] = [
  { name: '20261201-0001-operators-and-users', module: operatorsAndUsers },
  { name: '20261201-0002-sessions-and-rate-limits', module: sessionsAndRateLimits },
  { name: '20261201-0101-audit-events', module: auditEvents },
  { name: '20261201-0102-fleet-speed-books-revisions', module: fleetSpeedBooksRevisions },
  { name: '20261201-0201-invitations-and-password-resets', module: invitationsAndPasswordResets },
  { name: '20261201-0202-attachments', module: attachments },
  { name: '20261201-0501-card-issues', module: cardIssues },
  { name: '20261202-0601-sync-changes-and-currency-limit', module: syncChangesAndCurrencyLimit },
  { name: '20261202-0701-card-issue-codes', module: cardIssueCodes },
  { name: '20261205-0801-revision-contributors', module: revisionContributors },
  { name: '20261205-0802-user-address-per-operator', module: userAddressPerOperator },
  { name: '20261205-0901-signing-key-retirement', module: signingKeyRetirement },
  { name: '20261205-0902-approach-additive-policy', module: approachAdditivePolicy },
  { name: '20261205-0903-sync-stamps-at-commit', module: syncStampsAtCommit },
  { name: '20261205-1001-card-log-airframe-time-index', module: cardLogAirframeTimeIndex },
];

/** The names of the migrations this build knows, oldest first (a backup's must all be among them). */
export function migrationNames(): string[] {
  return MIGRATIONS.map(({ name }) => name);
}

export function createMigrator(sequelize: Sequelize, logger: Umzug<QueryInterface>['options']['logger'] = undefined): Umzug<QueryInterface> {
  return new Umzug({
    migrations: MIGRATIONS.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: MIGRATIONS_TABLE }),
    logger,
  });
}

/** Names of the migrations this build holds, in order (the `name` column of `schema_migrations`). */
export const MIGRATION_NAMES: readonly string[] = MIGRATIONS.map(({ name }) => name);

/** The table umzug records applied migrations in. */
export const MIGRATIONS_TABLE = 'schema_migrations';
