/**
 * MariaDB's own client programs, run for a backup (`mariadb-dump`) and a restore (`mariadb`):
 * the password in a private option file (mariadb-option-file.ts), the dump streamed to and from
 * disk through a SHA-256 tap, never held in memory.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createReadStream, createWriteStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { findProgram } from '../../db/instance';
import { parseDatabaseUrl } from '../../db/connection';
import { DomainError } from '../errors/domain-error';
import { DefinerStripper } from './dump-definers';
import { DigestTap, type FileDigest } from './file-digest';
import { withClientOptionFile } from './mariadb-option-file';

/** The first name MariaDB 10.5+ installs, then the older one it keeps as a link. */
const DUMP_PROGRAMS = ['mariadb-dump', 'mysqldump'];
const CLIENT_PROGRAMS = ['mariadb', 'mysql'];

/** What is kept of a program's error output for the sentence (it names the problem on its first lines). */
const MAX_ERROR_OUTPUT_BYTES = 16 * 1024;

function program(names: string[]): string {
  for (const name of names) {
    const path = findProgram(name);
    if (path) return path;
  }
  throw new DomainError('unavailable', 'mariadb_client_missing', `${names[0]} is not installed on this machine: install the MariaDB client programs (Debian: apt-get install mariadb-client).`);
}

/**
 * The options every run shares: the option file first (the programs read it only there), the
 * character set the database uses, and packets as large as MariaDB allows, for large rows.
 */
const common = (optionFile: string) => [`--defaults-extra-file=${optionFile}`, '--default-character-set=utf8mb4', '--max-allowed-packet=1G'];

/**
 * Dumps the database of `databaseUrl` into `file` (created with mode 0600; it must not exist)
 * as one consistent snapshot: `--single-transaction` reads every InnoDB table at one point in
 * time without locking writers out (MariaDB Knowledge Base, mariadb-dump), with the triggers that
 * stamp the sync cursor's change numbers, routines, events, and the `sync_counters` rows those
 * triggers count with. DEFINER clauses are dropped (dump-definers.ts).
 * @returns size and SHA-256 of the file as written
 */
export async function dumpDatabase(databaseUrl: string, file: string): Promise<FileDigest> {
  const dumper = program(DUMP_PROGRAMS);
  const { database } = parseDatabaseUrl(databaseUrl);
  return withClientOptionFile(databaseUrl, async (optionFile) => {
    const child = spawn(
      dumper,
      [...common(optionFile), '--single-transaction', '--routines', '--triggers', '--events', '--hex-blob', '--quick', '--no-tablespaces', '--', database],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    const errors = collectErrors(child);
    const tap = new DigestTap();
    const exit = exitOf(child);
    const written = pipeline(child.stdout!, new DefinerStripper(), tap, createWriteStream(file, { flags: 'wx', mode: 0o600 }));
    const [code] = await Promise.all([exit, written.catch(() => undefined)]);
    if (code !== 0) throw new DomainError('unavailable', 'dump_failed', `mariadb-dump could not dump the database ${database}: ${firstLine(errors()) || `it ended with exit code ${code}`}.`);
    await written;
    return tap.digest();
  });
}

/**
 * Loads the dump `file` into the database of `databaseUrl` with the `mariadb` client, stopping
 * at the first error. The bytes sent are hashed on the way, so a file that changed since it was
 * checked is caught.
 * @returns size and SHA-256 of what was sent
 */
export async function loadDump(databaseUrl: string, file: string): Promise<FileDigest> {
  const client = program(CLIENT_PROGRAMS);
  const { database } = parseDatabaseUrl(databaseUrl);
  return withClientOptionFile(databaseUrl, async (optionFile) => {
    const child = spawn(client, [...common(optionFile), '--batch', `--database=${database}`], { stdio: ['pipe', 'ignore', 'pipe'] });
    const errors = collectErrors(child);
    const tap = new DigestTap();
    const exit = exitOf(child);
    // The client closes its input at the first error; the sentence then comes from its exit, not the broken pipe.
    const sent = pipeline(createReadStream(file), tap, child.stdin!);
    const [code, sendError] = await Promise.all([exit, sent.then(() => undefined, (error: unknown) => error)]);
    if (code !== 0) throw new DomainError('unavailable', 'restore_load_failed', `MariaDB did not take the dump into ${database}: ${firstLine(errors()) || `the client ended with exit code ${code}`}.`);
    if (sendError) throw sendError;
    return tap.digest();
  });
}

function exitOf(child: ChildProcess): Promise<number> {
  return new Promise((resolve, reject) => {
    child.once('error', reject);
    child.once('close', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/**
 * Keeps the start and the end of the child's error output (the client echoes a failing statement,
 * however long, before its ERROR line); the function gives them as text.
 */
function collectErrors(child: ChildProcess): () => string {
  const head: Buffer[] = [];
  let headBytes = 0;
  let tail = Buffer.alloc(0);
  child.stderr!.on('data', (chunk: Buffer) => {
    if (headBytes < MAX_ERROR_OUTPUT_BYTES) {
      head.push(chunk.subarray(0, MAX_ERROR_OUTPUT_BYTES - headBytes));
      headBytes += chunk.length;
    }
    tail = Buffer.concat([tail, chunk]);
    if (tail.length > MAX_ERROR_OUTPUT_BYTES) tail = tail.subarray(tail.length - MAX_ERROR_OUTPUT_BYTES);
  });
  return () => (headBytes > MAX_ERROR_OUTPUT_BYTES ? `${Buffer.concat(head).toString('utf8')}\n${tail.toString('utf8')}` : Buffer.concat(head).toString('utf8'));
}

/**
 * The line that says what went wrong: MariaDB's `ERROR nnnn (…) at line n: …` where there is one,
 * else the first line that is neither a warning about the command line nor the client's echo of
 * a statement; without a trailing stop.
 */
function firstLine(output: string): string {
  const lines = output.split('\n').map((line) => line.trim());
  const error = lines.find((line) => /^ERROR \d+/.test(line));
  const other = lines.find((line) => line && !/^-+$/.test(line) && !/^\S+: \[Warning\]/.test(line));
  return (error ?? other ?? '').replace(/\.$/, '');
}
