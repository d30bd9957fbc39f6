/**
 * `npm run backup:check -- --from <folder>`: whether a backup folder is whole (every file of its
 * manifest present with its size and SHA-256, nothing else, a format and migrations this version
 * can restore), without touching any database: for the copies kept off the machine.
 * An entry point of its own, so that a build can compile it as one.
 */
import { migrationNames } from '../../db/migrator';
import { checkBackup } from './backup-check';
import { formatBytes } from './byte-sizes';
import { requiredOption, runCommand } from './cli-environment';

runCommand('check', async () => {
  const fromDir = requiredOption(process.argv.slice(2), 'from', 'npm run backup:check -- --from <backup folder>');
  const manifest = await checkBackup(fromDir, migrationNames());
  const bytes = manifest.files.reduce((sum, file) => sum + file.sizeBytes, 0);
  return [
    `The backup in ${fromDir} is whole: ${manifest.files.length} files (${formatBytes(bytes)}) match manifest.json, made ${manifest.createdAt} by Speedwright ${manifest.appVersion}; this version can restore it.`,
  ];
});
