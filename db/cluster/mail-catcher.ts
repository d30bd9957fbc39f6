/**
 * The local cluster's mail server: the development fake (server/dev/mail-catcher.ts) as a
 * background process on 127.0.0.1:CLUSTER_SMTP_PORT (4669 by default), its messages and pid
 * under `.data/cluster/mail/`. The instances start as production does, and production refuses
 * to start without SMTP_URL (README, "Running it for your operator"); invitations and password
 * resets sent through the cluster land in that folder. Run by path, not imported: `db/` imports
 * nothing of `server/`.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from 'node:fs';
import { connect } from 'node:net';
import { join } from 'node:path';
import { projectRoot } from '../instance';
import type { ClusterLayout } from './cluster-layout';
import { isAlive } from './galera-node';

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

/** The port of the cluster's mail server (CLUSTER_SMTP_PORT, 4669 by default). */
export function mailCatcherPort(): number {
  const raw = process.env['CLUSTER_SMTP_PORT'];
  if (raw === undefined || raw === '') return 4669;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1 || value > 65535) throw new Error(`CLUSTER_SMTP_PORT must be a port number, not "${raw}".`);
  return value;
}

/** The SMTP_URL the cluster's instances send with. */
export function mailCatcherUrl(): string {
  return `smtp://127.0.0.1:${mailCatcherPort()}`;
}

const mailDir = (layout: ClusterLayout) => join(layout.dir, 'mail');
const pidFile = (layout: ClusterLayout) => join(mailDir(layout), 'pid');

function mailCatcherPid(layout: ClusterLayout): number | undefined {
  if (!existsSync(pidFile(layout))) return undefined;
  const pid = Number.parseInt(readFileSync(pidFile(layout), 'utf8').trim(), 10);
  return Number.isInteger(pid) && pid > 0 && isAlive(pid) ? pid : undefined;
}

const accepts = (port: number) =>
  new Promise<boolean>((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => (socket.destroy(), resolve(true)));
    socket.once('error', () => resolve(false));
  });

/** Starts the mail server in the background unless it runs; resolves once it takes connections (at most 30 s). */
export async function startMailCatcher(layout: ClusterLayout): Promise<void> {
  if (mailCatcherPid(layout)) return;
  const port = mailCatcherPort();
  const dir = mailDir(layout);
  mkdirSync(join(dir, 'messages'), { recursive: true });
  const logFd = openSync(join(dir, 'mail-catcher.log'), 'a');
  const child = spawn(process.execPath, ['--import', 'tsx', join(projectRoot, 'server/dev/mail-catcher.ts'), join(dir, 'messages'), String(port)], {
    cwd: projectRoot,
    detached: true,
    stdio: ['ignore', logFd, logFd],
  });
  child.unref();
  writeFileSync(pidFile(layout), String(child.pid));
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (await accepts(port)) return;
    if (!mailCatcherPid(layout)) break;
    await sleep(100);
  }
  throw new Error(`The cluster's mail server did not start on port ${port}; see ${join(dir, 'mail-catcher.log')}.`);
}

/** Stops the mail server; false when it was not running. */
export async function stopMailCatcher(layout: ClusterLayout): Promise<boolean> {
  const pid = mailCatcherPid(layout);
  if (!pid) return false;
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + 10_000;
  while (isAlive(pid) && Date.now() < deadline) await sleep(100);
  if (isAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}
