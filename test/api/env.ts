import { readFileSync } from 'node:fs';
import { join } from 'node:path';

// Every API test file reads the URL of the database that global-setup.ts prepared.
const { url } = JSON.parse(readFileSync(join(__dirname, '..', '..', '.data', 'api-test-env.json'), 'utf8')) as { url: string };
process.env['DATABASE_URL'] = url;
