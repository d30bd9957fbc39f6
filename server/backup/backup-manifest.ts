/**
 * The manifest of a backup folder (`manifest.json`): what wrote it, which migrations the dumped
 * database had, and every other file of the folder with its size and SHA-256 (FIPS 180-4). A
 * restore trusts nothing in the folder that the manifest does not vouch for.
 *
 * A backup folder:
 *
 *   manifest.json           this file, written last (a folder without it is an unfinished backup)
 *   database.sql            mariadb-dump of the database (one consistent snapshot)
 *   attachments/<operator id>/<storage name>   the ATTACHMENTS_DIR files, byte for byte
 */
import { stat, readFile, rename, writeFile } from 'node:fs/promises';
import { posix, join } from 'node:path';
import { z } from 'zod';
import { DomainError } from '../errors/domain-error';

export const MANIFEST_FILE = 'manifest.json';
export const DUMP_FILE = 'database.sql';
export const ATTACHMENTS_FOLDER = 'attachments';

/** What the `format` field says, so that a stray JSON file is never taken for a backup. */
export const BACKUP_FORMAT = 'speedwright-backup';
/** Raised when the folder's layout or the manifest's meaning changes; a restore knows versions up to this one. */
export const BACKUP_FORMAT_VERSION = 1;

/** A manifest larger than this is not one we wrote (about 200 bytes a file: millions of files). */
const MAX_MANIFEST_BYTES = 256 * 1024 * 1024;

const SHA256_HEX = /^[0-9a-f]{64}$/;

export interface BackupFileEntry {
  /** Relative to the backup folder, `/`-separated. */
  path: string;
  sizeBytes: number;
  /** Lower-case hex SHA-256 of the file's bytes. */
  sha256: string;
}

export interface BackupManifest {
  format: typeof BACKUP_FORMAT;
  formatVersion: number;
  /** The Speedwright version (package.json) that wrote the backup. */
  appVersion: string;
  /** When the dump began (its snapshot is of that moment), ISO 8601 UTC. */
  createdAt: string;
  database: { name: string; serverVersion: string };
  /** The migrations applied to the dumped database, oldest first. */
  migrations: string[];
  /** Every file of the folder except the manifest: the dump first, then the attachments by path. */
  files: BackupFileEntry[];
}

/**
 * Whether `path` may name a file of a backup: the dump, or a file under `attachments/`, written
 * relative and normalised (no `..`, no `.`, no empty or absolute part), so a manifest can never
 * point a restore outside the folders it writes.
 */
export function isBackupFilePath(path: string): boolean {
  if (path === DUMP_FILE) return true;
  if (!path.startsWith(`${ATTACHMENTS_FOLDER}/`) || path.includes('\\') || path.includes('\0')) return false;
  const parts = path.split('/');
  return posix.normalize(path) === path && parts.every((part) => part !== '' && part !== '.' && part !== '..');
}

const fileEntrySchema = z.object({
  path: z.string().min(1).max(4096).refine(isBackupFilePath, 'is not the dump or a file under attachments/'),
  sizeBytes: z.number().int().min(0).max(Number.MAX_SAFE_INTEGER),
  sha256: z.string().regex(SHA256_HEX, 'is not a lower-case hex SHA-256'),
});

/** Version 1 of the manifest, as a restore reads it (extra fields are ignored). */
const manifestV1Schema = z.object({
  format: z.literal(BACKUP_FORMAT),
  formatVersion: z.literal(1),
  appVersion: z.string().min(1).max(100),
  createdAt: z.iso.datetime(),
  database: z.object({ name: z.string().min(1).max(64), serverVersion: z.string().max(200) }),
  migrations: z.array(z.string().min(1).max(200)),
  files: z.array(fileEntrySchema),
});

const refused = (code: string, message: string) => new DomainError('refused', code, message);

/**
 * Reads and checks `manifest.json` of `dir`: present, JSON, our format, a version this build
 * knows, each file named once and the dump among them.
 * @throws DomainError (refused) with one sentence naming what is wrong
 */
export async function readManifest(dir: string): Promise<BackupManifest> {
  const path = join(dir, MANIFEST_FILE);
  const size = await stat(path).then(
    (found) => (found.isFile() ? found.size : -1),
    () => undefined,
  );
  if (size === undefined) {
    throw refused('backup_incomplete', `${dir} holds no ${MANIFEST_FILE}: it is not a Speedwright backup, or the backup did not finish.`);
  }
  if (size < 0 || size > MAX_MANIFEST_BYTES) throw refused('backup_damaged', `${MANIFEST_FILE} in ${dir} is not a backup manifest: the backup is damaged.`);

  let parsed: unknown;
  try {
    parsed = JSON.parse(await readFile(path, 'utf8'));
  } catch {
    throw refused('backup_damaged', `${MANIFEST_FILE} in ${dir} is not valid JSON: the backup is damaged.`);
  }
  const head = z.object({ format: z.literal(BACKUP_FORMAT), formatVersion: z.number().int().positive() }).safeParse(parsed);
  if (!head.success) throw refused('backup_unknown_format', `${MANIFEST_FILE} in ${dir} does not describe a Speedwright backup.`);
  if (head.data.formatVersion > BACKUP_FORMAT_VERSION) {
    const by = (parsed as { appVersion?: unknown }).appVersion;
    throw refused(
      'backup_unknown_format',
      `The backup in ${dir} is in backup format ${head.data.formatVersion}${typeof by === 'string' ? ` (written by Speedwright ${by.slice(0, 100)})` : ''}, which this version does not know: restore it with that version or a newer one.`,
    );
  }

  const manifest = manifestV1Schema.safeParse(parsed);
  if (!manifest.success) {
    const issue = manifest.error.issues[0]!;
    throw refused('backup_damaged', `${MANIFEST_FILE} in ${dir} is damaged: ${issue.path.join('.') || 'the manifest'} ${issue.message}.`);
  }
  const seen = new Set<string>();
  for (const file of manifest.data.files) {
    if (seen.has(file.path)) throw refused('backup_damaged', `${MANIFEST_FILE} in ${dir} lists ${file.path} twice: the backup is damaged.`);
    seen.add(file.path);
  }
  if (!seen.has(DUMP_FILE)) throw refused('backup_damaged', `${MANIFEST_FILE} in ${dir} lists no ${DUMP_FILE}: the backup is damaged.`);
  return manifest.data;
}

/** Writes `manifest.json` last and atomically (a temporary name, then a rename), readable by the owner only. */
export async function writeManifest(dir: string, manifest: BackupManifest): Promise<void> {
  const temporary = join(dir, `${MANIFEST_FILE}.partial`);
  await writeFile(temporary, `${JSON.stringify(manifest, null, 2)}\n`, { mode: 0o600, flag: 'wx' });
  await rename(temporary, join(dir, MANIFEST_FILE));
}
