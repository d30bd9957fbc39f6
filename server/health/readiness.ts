/**
 * Readiness: whether this instance should get traffic now. Not while it shuts down (SIGTERM:
 * it finishes what is in flight and takes nothing new), not while the database does not answer,
 * and not before every migration this build holds has run (an upgrade migrates first; README,
 * "Upgrades"). Migrations recorded by a newer build are fine: during a rolling upgrade the old
 * instances keep serving until they are replaced. Liveness is simpler and lives in the routes.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Readiness } from '@shared/api/health';
import { MIGRATION_NAMES, MIGRATIONS_TABLE } from '../../db/migrator';

/** How long the database may take to answer a probe before the instance counts as not ready. */
export const READINESS_DB_TIMEOUT_MS = 2000;

export interface ReadinessProbe {
  check(): Promise<Readiness>;
  /** From now on, `check()` answers `shutting_down`. */
  beginDraining(): void;
  readonly draining: boolean;
}

/** MariaDB's ER_NO_SUCH_TABLE: the database has never been migrated. */
const NO_SUCH_TABLE = 1146;

function errnoOf(error: unknown): number | undefined {
  const cause = (error as { original?: { errno?: number } } | undefined)?.original;
  return cause?.errno;
}

function within<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
    timer.unref();
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

export function createReadinessProbe(sequelize: Sequelize, migrationNames: readonly string[] = MIGRATION_NAMES): ReadinessProbe {
  let draining = false;

  const appliedMigrations = async (): Promise<Set<string> | 'none' | 'down'> => {
    try {
      const rows = await within(sequelize.query<{ name: string }>(`SELECT name FROM ${MIGRATIONS_TABLE}`, { type: QueryTypes.SELECT }), READINESS_DB_TIMEOUT_MS);
      return new Set(rows.map((row) => row.name));
    } catch (error) {
      return errnoOf(error) === NO_SUCH_TABLE ? 'none' : 'down';
    }
  };

  return {
    get draining() {
      return draining;
    },
    beginDraining() {
      draining = true;
    },
    async check(): Promise<Readiness> {
      if (draining) return { status: 'not-ready', reason: 'shutting_down', message: 'This instance is shutting down: it finishes the requests in flight and takes no new ones.' };
      const applied = await appliedMigrations();
      if (applied === 'down') return { status: 'not-ready', reason: 'database_down', message: 'The database does not answer.' };
      const pending = migrationNames.filter((name) => applied === 'none' || !applied.has(name));
      if (pending.length > 0) {
        return {
          status: 'not-ready',
          reason: 'migrations_pending',
          message: `${pending.length} of the ${migrationNames.length} migrations of this build have not run on the database: run \`npm run migrate\`.`,
          pending,
        };
      }
      const recorded = applied === 'none' ? 0 : applied.size;
      // Checked again after the wait: a shutdown may have begun meanwhile.
      if (draining) return { status: 'not-ready', reason: 'shutting_down', message: 'This instance is shutting down: it finishes the requests in flight and takes no new ones.' };
      return { status: 'ready', db: 'ok', migrations: { applied: recorded, inBuild: migrationNames.length } };
    },
  };
}
