/**
 * Speedwright installed as an operator installs it (README, "Running it for your operator"):
 * the build (`dist/`), package.json and package-lock.json copied into a temporary folder,
 * `npm ci --omit=dev` there, and the compiled server started with `npm run serve` against a
 * fresh database on the private test instance, mail going to a local fake mail server.
 *
 * For the production tests: `prepareProductionCopy()` once, then `startProductionServer(copy)`
 * gives the server's URL and a stop function, and `runInCopy(copy, script, args)` runs one of
 * the package's npm scripts in the installed copy (`migrate`, and the operator commands as they
 * come) against the same database. A test that needs more steps appends them after those.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { projectRoot } from '../../db/instance';
import { openLocalDatabase } from '../../db/local';
import { startFakeSmtp, type FakeSmtp } from '../../server/dev/fake-smtp';
import { buildServer } from '../../tools/build-server';
import { freePort } from '../support/app-server';
import { REUSE_BUILD_VARIABLE } from './reuse-build';


export interface ProductionCopy {
  /** The temporary folder holding dist/, package.json, package-lock.json and the production node_modules. */
  dir: string;
  /** How long `npm ci --omit=dev` took, in seconds. */
  installSeconds: number;
  /** Size of the installed node_modules, in bytes. */
  installBytes: number;
  /** Removes the folder. */
  remove(): void;
}

function folderBytes(path: string): number {
  const stat = statSync(path, { throwIfNoEntry: false });
  if (!stat) return 0;
  if (!stat.isDirectory()) return stat.size;
  let total = 0;
  for (const entry of readdirSync(path)) total += folderBytes(join(path, entry));
  return total;
}

function npmEnv(): NodeJS.ProcessEnv {
  // No settings of the outer `npm test` or `npm run` may leak into the copy's own npm.
  const env: NodeJS.ProcessEnv = {};
  for (const [name, value] of Object.entries(process.env)) if (!name.startsWith('npm_')) env[name] = value;
  return { ...env, NG_CLI_ANALYTICS: 'false' };
}

/** Makes sure `dist/` holds a fresh server build and a web app build. */
async function ensureBuild(): Promise<void> {
  if (process.env[REUSE_BUILD_VARIABLE] === '1' && existsSync(join(projectRoot, 'dist/server/main.js'))) return;
  await buildServer();
  if (!existsSync(join(projectRoot, 'dist/app/browser/index.html'))) {
    const ng = spawnSync(process.execPath, [join(projectRoot, 'node_modules/@angular/cli/bin/ng.js'), 'build'], {
      cwd: projectRoot,
      stdio: 'inherit',
      env: { ...npmEnv(), NG_BUILD_OPTIMIZE_CHUNKS: '1' },
    });
    if (ng.status !== 0) throw new Error('The web app did not build.');
  }
}

/** Builds when needed, copies the build into a temporary folder and installs production dependencies there. */
export async function prepareProductionCopy(): Promise<ProductionCopy> {
  await ensureBuild();
  const dir = mkdtempSync(join(tmpdir(), 'speedwright-production-'));
  cpSync(join(projectRoot, 'dist'), join(dir, 'dist'), { recursive: true });
  for (const file of ['package.json', 'package-lock.json']) cpSync(join(projectRoot, file), join(dir, file));
  const started = Date.now();
  // The npm cache is warm on CI and development machines; --prefer-offline uses it first.
  const install = spawnSync('npm', ['ci', '--omit=dev', '--ignore-scripts=false', '--prefer-offline', '--no-audit', '--no-fund'], {
    cwd: dir,
    env: npmEnv(),
    encoding: 'utf8',
  });
  if (install.status !== 0) throw new Error(`npm ci --omit=dev failed in ${dir}:\n${install.stderr.slice(-3000)}`);
  return {
    dir,
    installSeconds: (Date.now() - started) / 1000,
    installBytes: folderBytes(join(dir, 'node_modules')),
    remove: () => rmSync(dir, { recursive: true, force: true }),
  };
}

export interface RunResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** `npm run <script> -- <args>` in the copy, with `env` over the test's own environment. */
export function runInCopy(copy: ProductionCopy, script: string, args: string[] = [], env: NodeJS.ProcessEnv = {}): Promise<RunResult> {
  return new Promise((resolve, reject) => {
    const child = spawn('npm', ['run', '--silent', script, ...(args.length > 0 ? ['--', ...args] : [])], { cwd: copy.dir, env: { ...npmEnv(), ...env } });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString('utf8')));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
    child.once('error', reject);
    child.once('close', (status) => resolve({ status, stdout, stderr }));
  });
}

/** An environment the production configuration check accepts (README's variables), for `port` and `databaseUrl`. */
export function productionEnv(port: number, databaseUrl: string, smtpUrl: string, copy: ProductionCopy): NodeJS.ProcessEnv {
  return {
    NODE_ENV: 'production',
    PORT: String(port),
    HOST: '127.0.0.1',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: randomBytes(32).toString('base64'),
    SIGNING_KEY_SECRET: randomBytes(32).toString('base64'),
    // Loopback may stay http (the configuration check allows it there only).
    PUBLIC_URL: `http://localhost:${port}`,
    SMTP_URL: smtpUrl,
    MAIL_FROM: 'Speedwright <speedwright@fleet.example>',
    ATTACHMENTS_DIR: join(copy.dir, 'attachments'),
    LOG_LEVEL: 'info',
  };
}

export interface ProductionServer {
  /** `http://localhost:<port>` */
  url: string;
  /** The fresh database the server uses (not migrated: run `runInCopy(copy, 'migrate', [], { DATABASE_URL })`). */
  databaseUrl: string;
  /** The environment the server runs with (the same secrets serve the copy's commands). */
  env: NodeJS.ProcessEnv;
  /** Whether the private test instance was started for this server (then the caller stops it at the end: `stopLocalInstance('test')`). */
  startedInstance: boolean;
  /** Folder of the fake mail server: `readMailbox(dir)` from server/dev/mailbox.ts reads what was sent. */
  mailboxDir: string;
  /** The server's output so far (JSON log lines, and anything it printed). */
  output(): string;
  /** SIGTERM to the supervisor; resolves with `npm run serve`'s exit code once it has ended (the whole group gets SIGKILL after 30 s). */
  stop(): Promise<number | null>;
}

/**
 * A fresh database `database` on the test instance (or, with `fresh: false`, the one already
 * there, e.g. restored from a backup), a fake mail server, and `npm run serve` in the copy with
 * a production environment (`envOverrides` over it), once it answers liveness.
 */
export async function startProductionServer(
  copy: ProductionCopy,
  { database = 'speedwright_production_test', envOverrides = {}, fresh = true }: { database?: string; envOverrides?: NodeJS.ProcessEnv; fresh?: boolean } = {},
): Promise<ProductionServer> {
  const { url: databaseUrl, instance } = await openLocalDatabase('test', database, { fresh });
  const mailboxDir = join(copy.dir, 'mailbox');
  const smtp: FakeSmtp = await startFakeSmtp({ dir: mailboxDir });
  const port = await freePort();
  const env = { ...productionEnv(port, databaseUrl, smtp.url, copy), ...envOverrides };
  // Its own process group, so that stop() reaches npm, the supervisor and its server processes.
  const child: ChildProcess = spawn('npm', ['run', '--silent', 'serve'], { cwd: copy.dir, env: { ...npmEnv(), ...env }, detached: true });
  let output = '';
  child.stdout!.on('data', (chunk: Buffer) => (output += chunk.toString('utf8')));
  child.stderr!.on('data', (chunk: Buffer) => (output += chunk.toString('utf8')));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const url = `http://localhost:${port}`;

  const stop = async (): Promise<number | null> => {
    if (child.exitCode === null && child.signalCode === null) {
      // The supervisor, as systemd stops it (its main process; npm would die of the signal
      // itself); the whole group when it has not said who it is.
      const supervisorPid = /Speedwright supervisor \(process (\d+)\)/.exec(output)?.[1];
      try {
        process.kill(supervisorPid ? Number(supervisorPid) : -child.pid!, 'SIGTERM');
      } catch {
        // already gone
      }
      const kill = setTimeout(() => {
        try {
          process.kill(-child.pid!, 'SIGKILL');
        } catch {
          // already gone
        }
      }, 30_000);
      const code = await exited;
      clearTimeout(kill);
      await smtp.stop();
      return code;
    }
    await smtp.stop();
    return child.exitCode;
  };

  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) {
      await smtp.stop();
      throw new Error(`npm run serve ended with code ${child.exitCode}:\n${output.slice(-3000)}`);
    }
    try {
      if ((await fetch(`${url}/api/health/live`)).ok && output.includes('Speedwright supervisor (process')) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`npm run serve did not answer /api/health/live within 60 s:\n${output.slice(-3000)}`);
    }
    await new Promise((done) => setTimeout(done, 200));
  }
  return { url, databaseUrl, env, startedInstance: instance.startedHere, mailboxDir, output: () => output, stop };
}
