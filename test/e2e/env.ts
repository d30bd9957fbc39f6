import { readFileSync } from 'node:fs';
import { join } from 'node:path';

// Each e2e test file reads the server URL that global-setup.ts started.
const { baseUrl } = JSON.parse(readFileSync(join(__dirname, '..', '..', '.data', 'e2e-env.json'), 'utf8')) as { baseUrl: string };
process.env['E2E_BASE_URL'] = baseUrl;
