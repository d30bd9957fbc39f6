import { readFileSync } from 'node:fs';
import { apiTestEnvFile } from './constants';

// Every API test file reads the URL of the database that global-setup.ts prepared.
const { url } = JSON.parse(readFileSync(apiTestEnvFile(), 'utf8')) as { url: string };
process.env['DATABASE_URL'] = url;
