/**
 * Benchmark of backup and restore (issue 14, part 4). Run: `npx tsx test/bench/backup.bench.ts`.
 *
 * A database of its own on the private test instance (`speedwright_bench_backup`, recreated each
 * run) with the invented demo data (invented demo data — not for flight), and an attachments
 * folder of generated files: 200 of 1 MB over 4 operator folders and one of 256 MB (random
 * bytes, so nothing compresses). Then `createBackup` into a new folder and `restoreBackup` into
 * a second empty database, in this process, measuring:
 *
 * - wall-clock time of each (process.hrtime.bigint()); targets: backup under 30 s, restore
 *   (its check hashes every file once more) under 60 s for the 456 MB;
 * - memory: this process's resident set sampled every 20 ms during each, above what it was just
 *   before; target under 96 MB, far below the 256 MB file, since every file streams through in
 *   chunks. (mariadb-dump and the mariadb client run as processes of their own, not counted.)
 *
 * The load average is printed beside the figures: the machine is shared.
 */
import { randomBytes } from 'node:crypto';
import { appendFileSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { mkdtemp } from 'node:fs/promises';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { createSequelize } from '../../db/connection';
import { openLocalDatabase, stopLocalInstance } from '../../db/local';
import { recreateDatabase } from '../../db/instance';
import { createMigrator } from '../../db/migrator';
import { createBackup } from '../../server/backup/backup.service';
import { restoreBackup } from '../../server/backup/restore.service';
import { seedDemo } from '../../server/dev/demo-seed';
import { initModels } from '../../server/models';

const BACKUP_TARGET_MS = 30_000;
const RESTORE_TARGET_MS = 60_000;
const MEMORY_TARGET_BYTES = 96 * 1024 * 1024;
const SMALL_FILES = 200;
const SMALL_FILE_BYTES = 1024 * 1024;
const LARGE_FILE_BYTES = 256 * 1024 * 1024;
const SOURCE = 'speedwright_bench_backup';
const TARGET = 'speedwright_bench_restore';

/** Runs `work` while sampling the resident set; its time and the largest rise above the start. */
async function measured<T>(work: () => Promise<T>): Promise<{ result: T; ms: number; rssRiseBytes: number }> {
  const startRss = process.memoryUsage.rss();
  let peak = startRss;
  const sampler = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage.rss());
  }, 20);
  const start = process.hrtime.bigint();
  try {
    const result = await work();
    const ms = Number(process.hrtime.bigint() - start) / 1e6;
    peak = Math.max(peak, process.memoryUsage.rss());
    return { result, ms, rssRiseBytes: peak - startRss };
  } finally {
    clearInterval(sampler);
  }
}

const mb = (bytes: number) => (bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(0)} KiB` : `${(bytes / 1024 / 1024).toFixed(1)} MiB`);

async function main(): Promise<boolean> {
  const work = await mkdtemp(join(tmpdir(), 'speedwright-bench-backup-'));
  const source = await openLocalDatabase('test', SOURCE, { fresh: true, log: () => undefined });
  try {
    const sequelize = createSequelize(source.url);
    initModels(sequelize);
    await createMigrator(sequelize).up();
    await seedDemo(sequelize, 'bench-password-not-for-use', { signingKeySecret: 'bench-signing-key-secret-0123456789-abcdefghij' });
    await sequelize.close();

    const attachments = join(work, 'attachments');
    for (let i = 0; i < SMALL_FILES; i++) {
      mkdirSync(join(attachments, String((i % 4) + 1)), { recursive: true });
      writeFileSync(join(attachments, String((i % 4) + 1), randomBytes(16).toString('hex')), randomBytes(SMALL_FILE_BYTES));
    }
    const large = join(attachments, '1', randomBytes(16).toString('hex'));
    for (let written = 0; written < LARGE_FILE_BYTES; written += 1 << 20) appendFileSync(large, randomBytes(1 << 20));
    const totalBytes = SMALL_FILES * SMALL_FILE_BYTES + LARGE_FILE_BYTES;

    const backup = await measured(() => createBackup({ databaseUrl: source.url, attachmentsDir: attachments, outDir: join(work, 'backup'), appVersion: 'bench' }));
    const target = await openLocalDatabase('test', TARGET, { fresh: true, log: () => undefined });
    const restore = await measured(() => restoreBackup({ fromDir: join(work, 'backup'), databaseUrl: target.url, attachmentsDir: join(work, 'restored-attachments') }));

    console.log(`attachments: ${backup.result.attachmentFiles} files, ${mb(totalBytes)}; dump ${mb(backup.result.databaseBytes)}; load average ${loadavg().map((n) => n.toFixed(2)).join(' ')}`);
    console.log(`backup:  ${(backup.ms / 1000).toFixed(1)} s (target < ${BACKUP_TARGET_MS / 1000} s), ${mb(totalBytes / (backup.ms / 1000))}/s; resident set rose ${mb(backup.rssRiseBytes)} (target < ${mb(MEMORY_TARGET_BYTES)})`);
    console.log(`restore: ${(restore.ms / 1000).toFixed(1)} s (target < ${RESTORE_TARGET_MS / 1000} s), ${mb(totalBytes / (restore.ms / 1000))}/s; resident set rose ${mb(restore.rssRiseBytes)} (target < ${mb(MEMORY_TARGET_BYTES)})`);
    return (
      backup.result.attachmentFiles === SMALL_FILES + 1 &&
      restore.result.attachmentFiles === SMALL_FILES + 1 &&
      backup.ms < BACKUP_TARGET_MS &&
      restore.ms < RESTORE_TARGET_MS &&
      backup.rssRiseBytes < MEMORY_TARGET_BYTES &&
      restore.rssRiseBytes < MEMORY_TARGET_BYTES
    );
  } finally {
    for (const name of [SOURCE, TARGET]) await recreateDatabase(source.instance, name);
    if (source.instance.startedHere) await stopLocalInstance('test');
    rmSync(work, { recursive: true, force: true });
  }
}

main().then(
  (met) => process.exit(met ? 0 : 1),
  (error: unknown) => {
    console.error(error);
    process.exit(1);
  },
);
