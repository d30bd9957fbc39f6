/**
 * What the backup and restore commands share: the database and attachments folder they act on
 * (the server's own variables), the running version, their arguments, and how a refusal ends
 * the process (exit code 1, one sentence, no stack trace).
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { openLocalDatabase, stopLocalInstance } from '../../db/local';
import { DomainError } from '../errors/domain-error';

export interface CliEnvironment {
  databaseUrl: string;
  /** ATTACHMENTS_DIR, resolved as the server resolves it (from the working folder). */
  attachmentsDir: string;
  appVersion: string;
  /** Stops the private database instance if this command started it. */
  close(): Promise<void>;
}

/** The server's default ATTACHMENTS_DIR (server/config.ts). */
const DEFAULT_ATTACHMENTS_DIR = '.data/attachments';

/**
 * DATABASE_URL and ATTACHMENTS_DIR as the server reads them; without DATABASE_URL, the private
 * development instance that `npm start` uses (started for the command and stopped after it).
 */
export async function cliEnvironment(env: NodeJS.ProcessEnv = process.env): Promise<CliEnvironment> {
  const attachmentsDir = resolve(env['ATTACHMENTS_DIR'] || DEFAULT_ATTACHMENTS_DIR);
  const appVersion = speedwrightVersion();
  const configured = env['DATABASE_URL'];
  if (configured) {
    if (!/^mariadb:\/\//.test(configured)) throw new DomainError('invalid', 'invalid_database_url', 'DATABASE_URL must start with mariadb://.');
    return { databaseUrl: configured, attachmentsDir, appVersion, close: async () => undefined };
  }
  const local = await openLocalDatabase('dev', 'speedwright', { log: () => undefined });
  return {
    databaseUrl: local.url,
    attachmentsDir,
    appVersion,
    close: async () => {
      if (local.instance.startedHere) await stopLocalInstance('dev');
    },
  };
}

/**
 * The version in Speedwright's package.json, found by walking up from this file (the same
 * under tsx, from `server/backup/`, and from a compiled bundle under `dist/`).
 */
export function speedwrightVersion(): string {
  for (let dir = __dirname, depth = 0; depth < 8; dir = dirname(dir), depth += 1) {
    const file = join(dir, 'package.json');
    if (!existsSync(file)) continue;
    const pkg = JSON.parse(readFileSync(file, 'utf8')) as { name?: string; version?: string };
    if (pkg.name === 'speedwright' && pkg.version) return pkg.version;
  }
  return process.env['npm_package_version'] ?? 'unknown';
}

/** The value of the one `--name <value>` option a command takes; a sentence with the usage otherwise. */
export function requiredOption(argv: string[], name: string, usage: string): string {
  let values: Record<string, string | boolean | undefined>;
  try {
    values = parseArgs({ args: argv, options: { [name]: { type: 'string' } }, strict: true, allowPositionals: false }).values;
  } catch {
    throw new DomainError('invalid', 'usage', `Usage: ${usage}`);
  }
  const value = values[name];
  if (typeof value !== 'string' || value.trim() === '') throw new DomainError('invalid', 'usage', `Usage: ${usage}`);
  return value;
}

/**
 * Runs a command: its summary lines on stdout; any refusal or failure as one sentence on stderr
 * with exit code 1. An unexpected error gives its message too, never a stack trace (set
 * SPEEDWRIGHT_DEBUG=1 for one).
 */
export function runCommand(what: string, command: () => Promise<string[]>): void {
  command().then(
    (lines) => {
      for (const line of lines) console.log(line);
    },
    (error: unknown) => {
      if (error instanceof DomainError) console.error(error.message);
      else console.error(`The ${what} failed: ${error instanceof Error ? error.message : String(error)}`);
      if (process.env['SPEEDWRIGHT_DEBUG'] === '1' && error instanceof Error) console.error(error.stack);
      process.exitCode = 1;
    },
  );
}
