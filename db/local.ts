/**
 * The private MariaDB instance as the start command, the db scripts and the tests use it.
 * Its secrets (the app user's password, the development session secret) are made once and
 * kept in `.data/local-secrets.json`, which git ignores.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createDatabase, instanceSpec, projectRoot, recreateDatabase, startInstance, stopInstance, type InstanceSpec, type RunningInstance } from './instance';

/**
 * `dev` for the start command, `test` for the test suites, `fault` for the one test that stops
 * its database on purpose (its own instance, so no other test loses the database under it).
 */
export type InstanceName = 'dev' | 'test' | 'fault';

/** Ports of the private instances: away from 3306 so a system MariaDB can run beside them. */
export const INSTANCE_PORTS: Record<InstanceName, number> = {
  dev: Number(process.env['DB_PORT'] ?? 4306),
  test: Number(process.env['TEST_DB_PORT'] ?? 4307),
  fault: Number(process.env['FAULT_DB_PORT'] ?? Number(process.env['TEST_DB_PORT'] ?? 4307) + 1),
};

interface LocalSecrets {
  /** Password of the product's own database user `speedwright@127.0.0.1`. */
  dbPassword: string;
  /** Password of `root@localhost`, on the socket only; nothing of the product connects as root over TCP. */
  rootPassword: string;
  sessionSecret: string;
  /** SIGNING_KEY_SECRET of the local server: encrypts the operators' signing keys at rest. */
  signingKeySecret: string;
}

export function localSecrets(): LocalSecrets {
  const file = join(projectRoot, '.data', 'local-secrets.json');
  const stored: Partial<LocalSecrets> = existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as Partial<LocalSecrets>) : {};
  // A secret added in a later version is made once and written beside the older ones.
  const secrets: LocalSecrets = {
    dbPassword: stored.dbPassword ?? randomBytes(18).toString('base64url'),
    rootPassword: stored.rootPassword ?? randomBytes(18).toString('base64url'),
    sessionSecret: stored.sessionSecret ?? randomBytes(32).toString('base64url'),
    signingKeySecret: stored.signingKeySecret ?? randomBytes(32).toString('base64url'),
  };
  if (Object.keys(stored).length !== Object.keys(secrets).length) {
    mkdirSync(join(projectRoot, '.data'), { recursive: true });
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  }
  return secrets;
}

export interface LocalDatabase {
  url: string;
  instance: RunningInstance;
}

/**
 * Starts (or reuses) the named instance and makes sure `database` and its user exist;
 * with `fresh`, the database is dropped first (tests start from nothing).
 */
export async function openLocalDatabase(
  name: InstanceName,
  database: string,
  { fresh = false, log }: { fresh?: boolean; log?: (line: string) => void } = {},
): Promise<LocalDatabase> {
  const instance = await startInstance(localInstanceSpec(name), log);
  if (fresh) await recreateDatabase(instance, database);
  const url = await createDatabase(instance, database, 'speedwright', localSecrets().dbPassword);
  return { url, instance };
}

export function stopLocalInstance(name: InstanceName): Promise<boolean> {
  return stopInstance(localInstanceSpec(name));
}

/** Where the named instance lives, its port and its root password. */
export function localInstanceSpec(name: InstanceName): InstanceSpec {
  return instanceSpec(name, INSTANCE_PORTS[name], localSecrets().rootPassword);
}
