/**
 * `npm run restore -- --from <folder>`: a backup into the empty database of DATABASE_URL (or of
 * the private development instance) and an empty or absent ATTACHMENTS_DIR (restore.service.ts).
 * An entry point of its own, so that a build can compile it as one.
 */
import { formatBytes } from './byte-sizes';
import { cliEnvironment, requiredOption, runCommand } from './cli-environment';
import { restoreBackup } from './restore.service';

runCommand('restore', async () => {
  const fromDir = requiredOption(process.argv.slice(2), 'from', 'npm run restore -- --from <backup folder>');
  const environment = await cliEnvironment();
  try {
    const result = await restoreBackup({ ...environment, fromDir, log: (line) => console.log(line) });
    const { manifest } = result;
    return [
      `Restored the backup of ${manifest.createdAt} (Speedwright ${manifest.appVersion}): the database, ${result.attachmentFiles} attachment file${result.attachmentFiles === 1 ? '' : 's'} (${formatBytes(result.attachmentBytes)}).`,
      result.migrationsRun.length > 0 ? `Migrations run after loading: ${result.migrationsRun.join(', ')}.` : 'The database was already at this version; no migration to run.',
      'Start the server with the SIGNING_KEY_SECRET it had when the backup was made, or it cannot sign new revisions.',
    ];
  } finally {
    await environment.close();
  }
});
