/**
 * Before the end-to-end tests: the real server on a free loopback port against a fresh e2e
 * database (`speedwright_e2e_test`) on the private test instance (test/support/app-server.ts).
 */
import '../support/shared-alias';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { startAppServer } from '../support/app-server';
import { E2E_PASSWORD } from './constants';

declare global {
  var speedwrightE2e: { stop(): Promise<void>; startedDb: boolean } | undefined;
}

export default async function globalSetup(): Promise<void> {
  const server = await startAppServer({ database: 'speedwright_e2e_test', password: E2E_PASSWORD, name: 'e2e' });
  globalThis.speedwrightE2e = { stop: server.stop, startedDb: server.startedDb };
  process.env['E2E_BASE_URL'] = server.baseUrl;
  writeFileSync(join(projectRoot, '.data', 'e2e-env.json'), JSON.stringify({ baseUrl: server.baseUrl }));
}
