/**
 * `npm run backup -- --out <folder>`: the database (DATABASE_URL, or the private development
 * instance) and ATTACHMENTS_DIR into a new folder with its manifest (backup.service.ts).
 * An entry point of its own, so that a build can compile it as one.
 */
import { formatBytes } from './byte-sizes';
import { createBackup } from './backup.service';
import { cliEnvironment, requiredOption, runCommand } from './cli-environment';

runCommand('backup', async () => {
  const outDir = requiredOption(process.argv.slice(2), 'out', 'npm run backup -- --out <new folder>');
  const environment = await cliEnvironment();
  try {
    const result = await createBackup({ ...environment, outDir, log: (line) => console.log(line) });
    const lines = [
      `Backup written to ${result.outDir}: the database (${formatBytes(result.databaseBytes)}), ${result.attachmentFiles} attachment file${result.attachmentFiles === 1 ? '' : 's'} (${formatBytes(result.attachmentBytes)}) and manifest.json.`,
    ];
    if (result.vanished.length > 0) {
      lines.push(`Left out, removed while the backup ran (source pages taken off a draft): ${result.vanished.join(', ')}.`);
    }
    if (result.recordsWithoutFile.length > 0) {
      lines.push(
        `Warning: ${result.recordsWithoutFile.length} attachment record${result.recordsWithoutFile.length === 1 ? ' has' : 's have'} no file in ${environment.attachmentsDir} (first: ${result.recordsWithoutFile[0]}); check that ATTACHMENTS_DIR is the server's.`,
      );
    }
    lines.push('Keep SIGNING_KEY_SECRET apart from the backup: the dump holds the signing keys only encrypted with it.');
    return lines;
  } finally {
    await environment.close();
  }
});
