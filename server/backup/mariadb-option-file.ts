/**
 * Connection options for MariaDB's own programs (mariadb-dump, mariadb) without the password on
 * their command line, where any user of the machine could read it (`ps`): an option file of
 * mode 0600 in a fresh private folder (mkdtemp makes it 0700), named with `--defaults-extra-file`
 * and removed as soon as the program has finished. Option-file syntax: MariaDB Knowledge Base,
 * "Configuring MariaDB with Option Files" (quoted values, backslash escapes).
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDatabaseUrl } from '../../db/connection';

/**
 * `value` as a double-quoted option-file value: the quotes keep `#`, `;`, leading and trailing
 * spaces literal; backslash, the quote and control characters are escaped as the option-file
 * reader expects.
 */
export function optionFileValue(value: string): string {
  const escaped = value.replace(/[\\"\n\r\t\b]/g, (character) => ({ '\\': '\\\\', '"': '\\"', '\n': '\\n', '\r': '\\r', '\t': '\\t', '\b': '\\b' })[character]!);
  return `"${escaped}"`;
}

/**
 * The `[client]` group for the account and server of `databaseUrl`. `protocol=tcp` because the
 * programs would otherwise take the host name `localhost` to mean the local socket, while the
 * server's connector always uses TCP.
 */
export function clientOptions(databaseUrl: string): string {
  const { host, port, username, password } = parseDatabaseUrl(databaseUrl);
  return [
    '[client]',
    `user=${optionFileValue(username)}`,
    `password=${optionFileValue(password)}`,
    `host=${optionFileValue(host)}`,
    `port=${port}`,
    'protocol=tcp',
    '',
  ].join('\n');
}

/**
 * Runs `work` with the path of a private option file for `databaseUrl`; the file and its
 * folder are gone when the promise settles, whatever happened.
 */
export async function withClientOptionFile<T>(databaseUrl: string, work: (optionFile: string) => Promise<T>): Promise<T> {
  const folder = await mkdtemp(join(tmpdir(), 'speedwright-mariadb-'));
  try {
    const optionFile = join(folder, 'client.cnf');
    await writeFile(optionFile, clientOptions(databaseUrl), { mode: 0o600, flag: 'wx' });
    return await work(optionFile);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}
