import { readFileSync } from 'node:fs';
import { apiTestEnvFile } from './constants';

// Every API test file reads the URL of the database that global-setup.ts prepared.
const { url, smtpUrl } = JSON.parse(readFileSync(apiTestEnvFile(), 'utf8')) as { url: string; smtpUrl: string };
process.env['DATABASE_URL'] = url;
process.env['SMTP_URL'] = smtpUrl;
