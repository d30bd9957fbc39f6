import { join } from 'node:path';

/** The demo password as the API tests seed it. */
export const TEST_PASSWORD = 'speedwright-test-password';

/** SIGNING_KEY_SECRET of the API tests; the seed encrypts the demo signing keys with it too. */
export const TEST_SIGNING_KEY_SECRET = 'test-signing-key-secret-that-is-long-enough-0123';

/**
 * The API tests' own database on the private test instance. Two people running the API tests
 * at once on one machine give each run its own name (API_TEST_DATABASE=speedwright_api_mine).
 */
export const API_TEST_DATABASE = process.env['API_TEST_DATABASE'] ?? 'speedwright_api_test';

/** The fake SMTP server's folder for this run (API_TEST_DATABASE keeps two runs apart). */
export function apiTestMailboxDir(): string {
  return join(__dirname, '..', '..', '.data', `mailbox-${API_TEST_DATABASE}`);
}

/** Uploaded attachments of this run. */
export function apiTestAttachmentsDir(): string {
  return join(__dirname, '..', '..', '.data', `attachments-${API_TEST_DATABASE}`);
}

/** Where global setup leaves the database URL for the test files. */
export function apiTestEnvFile(): string {
  return join(__dirname, '..', '..', '.data', `api-test-env-${API_TEST_DATABASE}.json`);
}
