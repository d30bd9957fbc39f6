/**
 * `checkBackup`: whether a backup folder is whole and readable by this build, before a restore
 * touches anything. Every file the manifest lists is there with its size and SHA-256, nothing
 * else is there, the format version is known and no migration of the backup is newer than this
 * build. Sizes are compared for every file before any is hashed, so a partial copy is named at
 * once rather than after hashing gigabytes.
 */
import { stat } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { DomainError } from '../errors/domain-error';
import { MANIFEST_FILE, readManifest, type BackupManifest } from './backup-manifest';
import { digestOfFile } from './file-digest';
import { filesUnder } from './folder-files';

const refused = (code: string, message: string) => new DomainError('refused', code, message);

const NOTHING_DONE = 'nothing was restored';

/**
 * @param knownMigrations the migrations of this build (db/migrator.ts `migrationNames()`)
 * @returns the manifest, once everything in it has been found as it says
 * @throws DomainError (refused) with one sentence naming the first file or field that is wrong
 */
export async function checkBackup(fromDir: string, knownMigrations: readonly string[]): Promise<BackupManifest> {
  const dir = resolve(fromDir);
  const folder = await stat(dir).catch(() => undefined);
  if (!folder?.isDirectory()) throw refused('backup_missing', `There is no backup folder at ${dir}.`);

  const manifest = await readManifest(dir);
  const known = new Set(knownMigrations);
  const unknown = manifest.migrations.find((name) => !known.has(name));
  if (unknown) {
    throw refused(
      'backup_newer_than_build',
      `The backup's database has migration ${unknown}, which this version of Speedwright does not know: restore it with Speedwright ${manifest.appVersion} or newer; ${NOTHING_DONE}.`,
    );
  }

  const present = new Map((await filesUnder(dir, (path) => join(dir, path))).filter((file) => file.path !== MANIFEST_FILE).map((file) => [file.path, file.sizeBytes]));
  const missing = manifest.files.filter((file) => !present.has(file.path));
  if (missing.length > 0) {
    const more = missing.length > 1 ? ` (and ${missing.length - 1} more)` : '';
    throw refused('backup_incomplete', `The backup in ${dir} is incomplete: ${missing[0]!.path}${more} is listed in ${MANIFEST_FILE} but missing; ${NOTHING_DONE}.`);
  }
  const listed = new Set(manifest.files.map((file) => file.path));
  const extra = [...present.keys()].filter((path) => !listed.has(path));
  if (extra.length > 0) {
    const more = extra.length > 1 ? ` (and ${extra.length - 1} more)` : '';
    throw refused('backup_unexpected_file', `The backup in ${dir} holds ${extra[0]}${more}, which ${MANIFEST_FILE} does not list: it is not the backup as written; ${NOTHING_DONE}.`);
  }
  for (const file of manifest.files) {
    const size = present.get(file.path)!;
    if (size !== file.sizeBytes) {
      throw refused('backup_damaged', `${file.path} in ${dir} is ${size} bytes where ${MANIFEST_FILE} says ${file.sizeBytes}: the backup is damaged or partly copied; ${NOTHING_DONE}.`);
    }
  }
  for (const file of manifest.files) {
    const { sha256 } = await digestOfFile(join(dir, ...file.path.split('/')));
    if (sha256 !== file.sha256) {
      throw refused('backup_damaged', `${file.path} in ${dir} does not match its SHA-256 in ${MANIFEST_FILE}: the backup is damaged; ${NOTHING_DONE}.`);
    }
  }
  return manifest;
}
