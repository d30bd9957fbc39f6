/**
 * One Express app per test file against the test database, plus signed-in supertest agents.
 */
import { pino, type Logger } from 'pino';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { Role } from '@shared/auth/roles';
import { createApp } from '../../server/app';
import { loadConfig, type ServerConfig } from '../../server/config';
import { createSequelize } from '../../db/connection';
import { readMailbox, waitForMail, type MailboxEntry } from '../../server/dev/mailbox';
import { initModels } from '../../server/models';
import { TEST_SIGNING_KEY_SECRET } from './constants';
import { apiTestAttachmentsDir, apiTestMailboxDir, TEST_PASSWORD } from './constants';

export { TEST_PASSWORD, TEST_SIGNING_KEY_SECRET };

/** The address links in the tests' mails start with. */
export const TEST_PUBLIC_URL = 'http://speedwright.test';

export interface Harness {
  app: ReturnType<typeof createApp>['app'];
  sequelize: ReturnType<typeof createSequelize>;
  /** Readiness answers 503 `shutting_down` from now on (as on SIGTERM). */
  beginDraining(): void;
  close(): Promise<void>;
}

/** `logger`: where the app logs (silent by default). */
export function startHarness(overrides: Partial<Record<keyof ServerConfig, string>> = {}, { logger = pino({ level: 'silent' }) }: { logger?: Logger } = {}): Harness {
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: process.env['DATABASE_URL'],
    SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
    SIGNING_KEY_SECRET: TEST_SIGNING_KEY_SECRET,
    LOG_LEVEL: 'silent',
    LOGIN_RATE_LIMIT_PER_15_MIN: '1000',
    APP_DIST: 'dist/app/browser',
    SMTP_URL: process.env['SMTP_URL'],
    MAILBOX_DIR: apiTestMailboxDir(),
    PUBLIC_URL: TEST_PUBLIC_URL,
    ATTACHMENTS_DIR: apiTestAttachmentsDir(),
    ...overrides,
  });
  const sequelize = createSequelize(config.DATABASE_URL);
  initModels(sequelize);
  const { app, beginDraining, close } = createApp({ config, sequelize, logger });
  return {
    app,
    sequelize,
    beginDraining,
    async close() {
      await close();
      await sequelize.close();
    },
  };
}

/** A supertest agent (it keeps cookies) with a fresh CSRF token. */
export async function csrfAgent(app: Harness['app']): Promise<{ agent: TestAgent; token: string }> {
  const agent = request.agent(app);
  const res = await agent.get('/api/auth/csrf').expect(200);
  return { agent, token: res.body.token as string };
}

export const demoEmail = (role: Role, domain = 'demo') => `${role}@${domain}.speedwright.example`;

/** Signs in and returns the agent with the token of its new (regenerated) session. */
export async function signIn(app: Harness['app'], email: string, password = TEST_PASSWORD): Promise<{ agent: TestAgent; token: string }> {
  const { agent, token } = await csrfAgent(app);
  await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email, password }).expect(200);
  const fresh = await agent.get('/api/auth/csrf').expect(200);
  return { agent, token: fresh.body.token as string };
}

/** Waits for the next message to `address` in this run's fake mailbox (mail is sent after the response). */
export function mailTo(address: string, match: (entry: MailboxEntry) => boolean = () => true, timeoutMs = 5000): Promise<MailboxEntry> {
  return waitForMail(apiTestMailboxDir(), (entry) => entry.to.includes(address.toLowerCase()) && match(entry), timeoutMs);
}

/** Every message to `address` so far. */
export function mailsTo(address: string): MailboxEntry[] {
  return readMailbox(apiTestMailboxDir()).filter((entry) => entry.to.includes(address.toLowerCase()));
}
