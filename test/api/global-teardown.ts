import '../support/shared-alias';
import { readFileSync } from 'node:fs';
import { stopLocalInstance } from '../../db/local';
import { apiTestEnvFile } from './constants';

/** Stops the test instance only if this run started it (the full `npm test` run manages its own). */
export default async function globalTeardown(): Promise<void> {
  await globalThis.speedwrightApiSmtp?.stop();
  const { startedHere } = JSON.parse(readFileSync(apiTestEnvFile(), 'utf8')) as { startedHere: boolean };
  if (startedHere) await stopLocalInstance('test');
}
