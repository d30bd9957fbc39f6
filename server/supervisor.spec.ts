/**
 * A server process that dies is replaced (security issue 12, finding 2): the real server
 * (server/main.ts, as `npm start` and `npm run serve` run it) with one process, that process
 * killed as a crash would end it, and the port answering again from its replacement.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { projectRoot } from '../db/instance';
import { freePort, stopProcess } from '../test/support/app-server';
import { RESTART_FIRST_DELAY_MS, RESTART_MAX_DELAY_MS, restartDelayMs } from './supervisor';

jest.setTimeout(120_000);

describe('restartDelayMs', () => {
  // Exponential back-off with a cap (common practice for process supervisors).
  it('waits 1 s after a first death, doubles with each quick death in a row, and never more than 30 s', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 50].map(restartDelayMs)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000]);
    expect(restartDelayMs(1)).toBe(RESTART_FIRST_DELAY_MS);
    expect(restartDelayMs(1000)).toBe(RESTART_MAX_DELAY_MS);
  });
});

/** Collects a child's output and waits for a line that matches. */
function outputOf(child: ChildProcess) {
  let text = '';
  const waiters: { pattern: RegExp; from: number; resolve: (match: RegExpMatchArray) => void; reject: (error: Error) => void }[] = [];
  const feed = (chunk: Buffer) => {
    text += chunk.toString('utf8');
    for (const waiter of [...waiters]) {
      const match = text.slice(waiter.from).match(waiter.pattern);
      if (match) {
        waiters.splice(waiters.indexOf(waiter), 1);
        waiter.resolve(match);
      }
    }
  };
  child.stdout!.on('data', feed);
  child.stderr!.on('data', feed);
  child.once('exit', (code) => {
    for (const waiter of waiters.splice(0)) waiter.reject(new Error(`The server ended (${code}) before ${waiter.pattern}. Output:\n${text}`));
  });
  return {
    get text() {
      return text;
    },
    /** The first match of `pattern` after what has been read so far (or, with `from`, after that offset). */
    waitFor(pattern: RegExp, timeoutMs = 60_000, from = text.length): Promise<RegExpMatchArray> {
      const already = text.slice(from).match(pattern);
      if (already) return Promise.resolve(already);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`No ${pattern} within ${timeoutMs} ms. Output:\n${text}`)), timeoutMs);
        waiters.push({ pattern, from, resolve: (match) => (clearTimeout(timer), resolve(match)), reject: (error) => (clearTimeout(timer), reject(error)) });
      });
    },
  };
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

describe('the supervised server', () => {
  let server: ChildProcess | undefined;
  afterEach(async () => {
    if (server) await stopProcess(server);
  });

  it('replaces its one server process when that process dies, and stops cleanly on SIGTERM', async () => {
    const port = await freePort();
    server = spawn(process.execPath, ['--import', 'tsx', join(projectRoot, 'server/main.ts')], {
      cwd: projectRoot,
      stdio: ['ignore', 'pipe', 'pipe'],
      env: {
        ...process.env,
        NODE_ENV: 'test',
        WEB_CONCURRENCY: '1',
        PORT: String(port),
        HOST: '127.0.0.1',
        SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
        SIGNING_KEY_SECRET: 'test-signing-key-secret-that-is-long-enough-0123456789',
        LOG_LEVEL: 'info',
      },
    });
    const output = outputOf(server);
    const first = Number((await output.waitFor(/listening on port \d+ \(process (\d+)\)/, 60_000, 0))[1]);
    expect((await fetch(`http://127.0.0.1:${port}/api/health`)).status).toBe(200);

    // A crash: the process ends at once, without cleaning up.
    process.kill(first, 'SIGKILL');
    await output.waitFor(new RegExp(`Server process ${first} ended \\(SIGKILL\\) after \\d+ s; starting another in 1 s\\.`));
    const second = Number((await output.waitFor(/listening on port \d+ \(process (\d+)\)/))[1]);
    expect(second).not.toBe(first);
    expect((await fetch(`http://127.0.0.1:${port}/api/health`)).status).toBe(200);

    const exited = new Promise<number | null>((resolve) => server!.once('exit', (code) => resolve(code)));
    server.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(alive(second)).toBe(false);
  });
});
