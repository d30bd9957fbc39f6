import { randomBytes } from 'node:crypto';
import { loadConfig } from './config';

/** An environment production accepts: strong secrets, an https address, a mail server and sender. */
function productionEnv(overrides: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
  return {
    NODE_ENV: 'production',
    DATABASE_URL: 'mariadb://speedwright:pw@db.internal:3306/speedwright',
    SESSION_SECRET: randomBytes(32).toString('base64'),
    SIGNING_KEY_SECRET: randomBytes(32).toString('base64'),
    PUBLIC_URL: 'https://speeds.fleet.example',
    SMTP_URL: 'smtps://speedwright:pw@mail.fleet.example:465',
    MAIL_FROM: 'Speedwright <speedwright@fleet.example>',
    ...overrides,
  };
}

/** The sentence loadConfig refuses with, or '' when it accepts. */
function refusal(env: NodeJS.ProcessEnv): string {
  try {
    loadConfig(env);
    return '';
  } catch (error) {
    return (error as Error).message;
  }
}

describe('loadConfig in production', () => {
  it('accepts a complete production environment, NODE_ENV unset included (production is the default)', () => {
    expect(refusal(productionEnv())).toBe('');
    const { NODE_ENV: _unset, ...withoutNodeEnv } = productionEnv();
    expect(loadConfig(withoutNodeEnv).NODE_ENV).toBe('production');
  });

  it('refuses a missing secret, naming it', () => {
    expect(refusal(productionEnv({ SESSION_SECRET: undefined }))).toContain('SESSION_SECRET is not set: make one with `openssl rand -base64 32`.');
    expect(refusal(productionEnv({ SIGNING_KEY_SECRET: undefined }))).toContain('SIGNING_KEY_SECRET is not set');
  });

  it('refuses a weak or published secret, naming the variable and why', () => {
    expect(refusal(productionEnv({ SESSION_SECRET: 'x'.repeat(40) }))).toContain('SESSION_SECRET uses only 1 different characters (at least 10 needed).');
    expect(refusal(productionEnv({ SIGNING_KEY_SECRET: 'test-signing-key-secret-that-is-long-enough-0123' }))).toContain(
      'SIGNING_KEY_SECRET is a value published with Speedwright (in its tests or documentation), so it is not secret.',
    );
    expect(refusal(productionEnv({ SESSION_SECRET: 'changeme-please-0123456789-abcdefghij' }))).toContain('SESSION_SECRET contains "changeme"');
  });

  it('refuses one value for both secrets', () => {
    const one = randomBytes(32).toString('base64');
    expect(refusal(productionEnv({ SESSION_SECRET: one, SIGNING_KEY_SECRET: one }))).toContain('SESSION_SECRET and SIGNING_KEY_SECRET are the same value');
  });

  it('refuses a PUBLIC_URL that is unset, or plain http outside this machine', () => {
    expect(refusal(productionEnv({ PUBLIC_URL: undefined }))).toContain('PUBLIC_URL is not set');
    expect(refusal(productionEnv({ PUBLIC_URL: 'http://speeds.fleet.example' }))).toContain('PUBLIC_URL must be an https:// address outside this machine, not http://speeds.fleet.example');
    for (const local of ['http://localhost:4300', 'http://127.0.0.1:8080', 'http://[::1]:4300', 'http://speedwright.localhost']) {
      expect(refusal(productionEnv({ PUBLIC_URL: local }))).toBe('');
    }
    expect(refusal(productionEnv({ PUBLIC_URL: 'ftp://speeds.fleet.example' }))).toContain('PUBLIC_URL must be an http(s) URL');
  });

  it('refuses a missing SMTP_URL, and the development sender beyond this machine', () => {
    expect(refusal(productionEnv({ SMTP_URL: undefined }))).toContain('SMTP_URL is not set');
    expect(refusal(productionEnv({ MAIL_FROM: undefined }))).toContain('MAIL_FROM is not set');
    expect(refusal(productionEnv({ MAIL_FROM: 'Speedwright <no-reply@speedwright.localhost>' }))).toContain('MAIL_FROM is "Speedwright <no-reply@speedwright.localhost>"');
    // npm start: the demo on localhost, mail to its fake mailbox, the default sender.
    expect(refusal(productionEnv({ MAIL_FROM: undefined, PUBLIC_URL: 'http://localhost:4300', SMTP_URL: 'smtp://127.0.0.1:2525' }))).toBe('');
  });

  it('lists every problem at once, one line each', () => {
    const message = refusal(productionEnv({ SESSION_SECRET: 'a'.repeat(40), PUBLIC_URL: undefined, SMTP_URL: undefined }));
    expect(message.split('\n').slice(1).map((line) => line.trim().split(' ')[0])).toEqual(['SESSION_SECRET', 'PUBLIC_URL', 'SMTP_URL']);
  });

  it('keeps the development and test rules for NODE_ENV=test (the test suites and e2e)', () => {
    expect(refusal(productionEnv({ NODE_ENV: 'test', SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789', PUBLIC_URL: undefined, SMTP_URL: undefined }))).toBe('');
  });

  it('checks SHUTDOWN_GRACE_SECONDS: 10 by default, whole seconds up to 600', () => {
    expect(loadConfig(productionEnv()).SHUTDOWN_GRACE_SECONDS).toBe(10);
    expect(loadConfig(productionEnv({ SHUTDOWN_GRACE_SECONDS: '30' })).SHUTDOWN_GRACE_SECONDS).toBe(30);
    expect(refusal(productionEnv({ SHUTDOWN_GRACE_SECONDS: '601' }))).toContain('SHUTDOWN_GRACE_SECONDS');
  });
});
