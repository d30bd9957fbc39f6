/**
 * A backup folder is checked whole before a restore touches anything: each way a folder can be
 * damaged or partial is refused with one sentence that names the file. SHA-256 per FIPS 180-4
 * (Node's crypto).
 */
import { createHash } from 'node:crypto';
import { mkdirSync, rmSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import { mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { migrationNames } from '../../db/migrator';
import { DomainError } from '../errors/domain-error';
import { checkBackup } from './backup-check';
import { BACKUP_FORMAT, type BackupManifest } from './backup-manifest';

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

const FILES: Record<string, Buffer> = {
  'database.sql': Buffer.from('-- dump\nCREATE TABLE t (id INT PRIMARY KEY);\n'),
  'attachments/1/0a1b2c': Buffer.from('%PDF-1.4 invented source page\n'),
  'attachments/2/3d4e5f': Buffer.alloc(70_000, 7),
};

let root: string;
beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'speedwright-check-'));
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

let count = 0;
/** A well-formed backup folder; `change` edits the manifest before it is written. */
function backupFolder(change: (manifest: BackupManifest) => unknown = (manifest) => manifest): string {
  const dir = join(root, `backup-${(count += 1)}`);
  for (const [path, bytes] of Object.entries(FILES)) {
    mkdirSync(dirname(join(dir, path)), { recursive: true });
    writeFileSync(join(dir, path), bytes);
  }
  const manifest: BackupManifest = {
    format: BACKUP_FORMAT,
    formatVersion: 1,
    appVersion: '0.1.0',
    createdAt: '2026-12-05T22:00:00.000Z',
    database: { name: 'speedwright', serverVersion: '10.11.19-MariaDB' },
    migrations: migrationNames(),
    files: Object.entries(FILES).map(([path, bytes]) => ({ path, sizeBytes: bytes.length, sha256: sha256(bytes) })),
  };
  writeFileSync(join(dir, 'manifest.json'), JSON.stringify(change(manifest)));
  return dir;
}

async function refusal(dir: string): Promise<DomainError> {
  const error = await checkBackup(dir, migrationNames()).then(
    () => undefined,
    (thrown: unknown) => thrown,
  );
  expect(error).toBeInstanceOf(DomainError);
  return error as DomainError;
}

describe('checkBackup', () => {
  it('accepts a whole backup and gives its manifest', async () => {
    const manifest = await checkBackup(backupFolder(), migrationNames());
    expect(manifest.files.map((file) => file.path)).toEqual(Object.keys(FILES));
  });

  it('refuses a folder that is not there, or holds no manifest (a backup that did not finish)', async () => {
    expect((await refusal(join(root, 'nowhere'))).message).toBe(`There is no backup folder at ${join(root, 'nowhere')}.`);
    const dir = backupFolder();
    unlinkSync(join(dir, 'manifest.json'));
    const error = await refusal(dir);
    expect(error.code).toBe('backup_incomplete');
    expect(error.message).toContain('holds no manifest.json');
  });

  it('refuses a manifest that is not JSON, not ours, or of a format version this build does not know', async () => {
    const broken = backupFolder();
    writeFileSync(join(broken, 'manifest.json'), '{"format": "speedwright-backup", "formatVer');
    expect((await refusal(broken)).message).toContain('manifest.json in');
    expect((await refusal(backupFolder(() => ({ hello: 'world' })))).code).toBe('backup_unknown_format');
    const future = await refusal(backupFolder((manifest) => ({ ...manifest, formatVersion: 2, appVersion: '9.0.0' })));
    expect(future.code).toBe('backup_unknown_format');
    expect(future.message).toContain('backup format 2 (written by Speedwright 9.0.0)');
  });

  it('refuses a backup whose database has a migration newer than this build', async () => {
    const error = await refusal(backupFolder((manifest) => ({ ...manifest, appVersion: '0.2.0', migrations: [...manifest.migrations, '20990101-0001-from-the-future'] })));
    expect(error.code).toBe('backup_newer_than_build');
    expect(error.message).toContain('20990101-0001-from-the-future');
    expect(error.message).toContain('Speedwright 0.2.0 or newer');
  });

  it('names a file the manifest lists that is missing', async () => {
    const dir = backupFolder();
    unlinkSync(join(dir, 'attachments/2/3d4e5f'));
    const error = await refusal(dir);
    expect(error.code).toBe('backup_incomplete');
    expect(error.message).toBe(`The backup in ${dir} is incomplete: attachments/2/3d4e5f is listed in manifest.json but missing; nothing was restored.`);
  });

  it('names a file the manifest does not list', async () => {
    const dir = backupFolder();
    writeFileSync(join(dir, 'attachments/1/stray'), 'not from the backup');
    const error = await refusal(dir);
    expect(error.code).toBe('backup_unexpected_file');
    expect(error.message).toContain('attachments/1/stray');
  });

  it('names a file cut short and a file with one byte changed', async () => {
    const short = backupFolder();
    writeFileSync(join(short, 'attachments/2/3d4e5f'), FILES['attachments/2/3d4e5f']!.subarray(0, 65_536));
    const cut = await refusal(short);
    expect(cut.code).toBe('backup_damaged');
    expect(cut.message).toContain('attachments/2/3d4e5f');
    expect(cut.message).toContain('65536 bytes where manifest.json says 70000');

    const flipped = backupFolder();
    const bytes = Buffer.from(FILES['database.sql']!);
    bytes[10] = bytes[10]! ^ 0x01;
    writeFileSync(join(flipped, 'database.sql'), bytes);
    const changed = await refusal(flipped);
    expect(changed.code).toBe('backup_damaged');
    expect(changed.message).toBe(`database.sql in ${flipped} does not match its SHA-256 in manifest.json: the backup is damaged; nothing was restored.`);
  });

  it('refuses a manifest that names a file outside the backup, twice, or not the dump', async () => {
    const outside = await refusal(backupFolder((manifest) => ({ ...manifest, files: [...manifest.files, { path: 'attachments/../../etc/passwd', sizeBytes: 1, sha256: 'a'.repeat(64) }] })));
    expect(outside.code).toBe('backup_damaged');
    expect(outside.message).toContain('files.3.path is not the dump or a file under attachments/');
    expect((await refusal(backupFolder((manifest) => ({ ...manifest, files: [...manifest.files, manifest.files[1]] })))).message).toContain('lists attachments/1/0a1b2c twice');
    expect((await refusal(backupFolder((manifest) => ({ ...manifest, files: manifest.files.slice(1) })))).message).toContain('lists no database.sql');
  });

  it('refuses a symbolic link inside the backup (it could point anywhere)', async () => {
    const dir = backupFolder();
    symlinkSync('/etc/hostname', join(dir, 'attachments/1/link'));
    const error = await refusal(dir);
    expect(error.code).toBe('not_a_file');
    expect(error.message).toContain('is a symbolic link');
  });
});
