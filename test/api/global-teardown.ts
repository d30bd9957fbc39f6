import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { stopLocalInstance } from '../../db/local';

/** Stops the test instance only if this run started it (the full `npm test` run manages its own). */
export default async function globalTeardown(): Promise<void> {
  const { startedHere } = JSON.parse(readFileSync(join(projectRoot, '.data', 'api-test-env.json'), 'utf8')) as { startedHere: boolean };
  if (startedHere) await stopLocalInstance('test');
}
