/**
 * One node of the local MariaDB Galera cluster: its own `my.cnf`, data directory, socket, SQL
 * port and group-communication ports, all under `.data/cluster/nodeN/`. Settings follow
 * MariaDB's "Configuring MariaDB Galera Cluster" (wsrep_on, wsrep_provider, binlog_format=ROW,
 * innodb_autoinc_lock_mode=2, InnoDB as the default engine); state transfer is rsync.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type * as mariadb from 'mariadb';
import { ensureMariadbInstalled, rootConnection, type InstanceSpec, type RunningInstance } from '../instance';
import type { GaleraNodeLayout } from './cluster-layout';
import { GALERA_PROVIDER } from './debian-packages';

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

/** The node as db/instance.ts's helpers (root connection, createDatabase) see it. */
export function nodeInstance(node: GaleraNodeLayout, rootPassword: string): RunningInstance {
  const spec: InstanceSpec = { dir: node.dir, port: node.sqlPort, rootPassword };
  return { ...spec, socketPath: join(node.dir, 'sock'), startedHere: true };
}

/** The node's option file: everything it runs with (the SST script reads it too). */
export function nodeConfig(node: GaleraNodeLayout, all: GaleraNodeLayout[]): string {
  const members = all.map((peer) => `127.0.0.1:${peer.groupPort}`).join(',');
  return [
    '# The local Galera cluster of npm run cluster:start; made by db/cluster/galera-node.ts.',
    '[mysqld]',
    `datadir=${join(node.dir, 'data')}`,
    `socket=${join(node.dir, 'sock')}`,
    `pid-file=${join(node.dir, 'pid')}`,
    `port=${node.sqlPort}`,
    'bind-address=127.0.0.1',
    'user=root',
    'skip-name-resolve',
    'character-set-server=utf8mb4',
    'collation-server=utf8mb4_unicode_ci',
    'innodb-buffer-pool-size=64M',
    'default-storage-engine=InnoDB',
    'binlog-format=ROW',
    'innodb-autoinc-lock-mode=2',
    // The app's own user creates the sync triggers in its migrations; with the binary log that
    // wsrep keeps, MariaDB asks for this (MariaDB's "Binary Logging of Stored Routines").
    'log-bin-trust-function-creators=1',
    'wsrep-on=ON',
    `wsrep-provider=${GALERA_PROVIDER}`,
    'wsrep-cluster-name=speedwright-local',
    `wsrep-cluster-address=gcomm://${members}`,
    `wsrep-node-name=${node.name}`,
    'wsrep-node-address=127.0.0.1',
    `wsrep-node-incoming-address=127.0.0.1:${node.sqlPort}`,
    `wsrep-provider-options="gmcast.listen_addr=tcp://127.0.0.1:${node.groupPort};ist.recv_addr=127.0.0.1:${node.istPort};gcache.size=128M"`,
    'wsrep-sst-method=rsync',
    `wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    // Read-your-writes across nodes: a read waits until its node has applied every transaction
    // committed in the cluster before it started (MariaDB's wsrep_sync_wait, 1 = reads). Without
    // it, a session written through one instance's node can be missing a moment later on another
    // node, and a request routed there is answered "sign in".
    'wsrep-sync-wait=1',
    // An autocommit statement that loses certification is retried by the node itself.
    'wsrep-retry-autocommit=4',
    '',
  ].join('\n');
}

function readPid(node: GaleraNodeLayout): number | undefined {
  const file = join(node.dir, 'pid');
  if (!existsSync(file)) return undefined;
  const pid = Number.parseInt(readFileSync(file, 'utf8').trim(), 10);
  return Number.isInteger(pid) && pid > 0 ? pid : undefined;
}

export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** The running mariadbd's pid, if any. */
export function nodePid(node: GaleraNodeLayout): number | undefined {
  const pid = readPid(node);
  return pid && isAlive(pid) ? pid : undefined;
}

/** `safe_to_bootstrap` of the node's grastate.dat (true for a node that never ran). */
export function safeToBootstrap(node: GaleraNodeLayout): boolean {
  const file = join(node.dir, 'data', 'grastate.dat');
  if (!existsSync(file)) return true;
  return /^safe_to_bootstrap:\s*1/m.test(readFileSync(file, 'utf8'));
}

/**
 * Marks the node safe to bootstrap (after every node was killed, none is): the local cluster's
 * start then bootstraps from it, as MariaDB's "Galera Cluster Recovery" describes for the node
 * with the latest state.
 */
export function markSafeToBootstrap(node: GaleraNodeLayout): void {
  const file = join(node.dir, 'data', 'grastate.dat');
  if (!existsSync(file)) return;
  writeFileSync(file, readFileSync(file, 'utf8').replace(/^safe_to_bootstrap:\s*0/m, 'safe_to_bootstrap: 1'));
}

/** The `seqno` of grastate.dat (-1 when unknown), to choose the node with the latest state. */
export function savedSeqno(node: GaleraNodeLayout): number {
  const file = join(node.dir, 'data', 'grastate.dat');
  if (!existsSync(file)) return -1;
  const match = /^seqno:\s*(-?\d+)/m.exec(readFileSync(file, 'utf8'));
  return match ? Number(match[1]) : -1;
}

/**
 * Run as root, rsync's daemon (the joiner's side of the rsync state transfer, which
 * wsrep_sst_rsync configures itself) drops to the user `nobody` (rsyncd.conf(5), "uid"), and then
 * cannot write a data directory that root's mariadbd owns. So before a node joins, its data
 * directory is handed to `nobody` (root's mariadbd still reads and writes it). Not needed when not root.
 */
function letStateTransferWrite(dataDir: string): void {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) return;
  const chown = spawnSync('chown', ['-R', 'nobody:nogroup', dataDir], { encoding: 'utf8' });
  if (chown.status !== 0) throw new Error(`chown nobody ${dataDir} failed: ${chown.stderr}`);
}

/** Starts the node's mariadbd (bootstrapping a new cluster with `bootstrap`) and returns at once. */
export function launchNode(node: GaleraNodeLayout, all: GaleraNodeLayout[], bootstrap: boolean): void {
  const { server, installDb } = ensureMariadbInstalled();
  const dataDir = join(node.dir, 'data');
  mkdirSync(node.dir, { recursive: true });
  const configFile = join(node.dir, 'my.cnf');
  writeFileSync(configFile, nodeConfig(node, all));
  if (!existsSync(join(dataDir, 'mysql'))) {
    rmSync(dataDir, { recursive: true, force: true });
    const init = spawnSync(installDb, [`--defaults-file=${configFile}`, '--auth-root-authentication-method=normal', '--skip-test-db', '--user=root', '--wsrep-on=OFF'], {
      encoding: 'utf8',
    });
    if (init.status !== 0) throw new Error(`mariadb-install-db failed for ${node.name}: ${init.stderr || init.stdout}`);
  }
  const logFd = openSync(join(node.dir, 'mariadbd.log'), 'a');
  const args = [`--defaults-file=${configFile}`, ...(bootstrap ? ['--wsrep-new-cluster'] : [])];
  if (!bootstrap) letStateTransferWrite(dataDir);
  const child = spawn(server, args, { detached: true, stdio: ['ignore', logFd, logFd] });
  child.unref();
}

async function status(conn: mariadb.Connection, name: string): Promise<string> {
  const rows = (await conn.query('SHOW STATUS LIKE ?', [name])) as { Value: string }[];
  return rows[0]?.Value ?? '';
}

export interface NodeState {
  clusterSize: number;
  state: string;
  ready: boolean;
}

/** The node's view of the cluster (undefined when it does not answer on its socket). */
export async function nodeState(node: GaleraNodeLayout, rootPassword: string): Promise<NodeState | undefined> {
  let conn: mariadb.Connection | undefined;
  try {
    conn = await rootConnection(nodeInstance(node, rootPassword), 1000);
    return {
      clusterSize: Number(await status(conn, 'wsrep_cluster_size')),
      state: await status(conn, 'wsrep_local_state_comment'),
      ready: (await status(conn, 'wsrep_ready')) === 'ON',
    };
  } catch {
    return undefined;
  } finally {
    await conn?.end().catch(() => undefined);
  }
}

/** Waits until the node is Synced and sees at least `size` members; throws with its log's tail. */
export async function waitSynced(node: GaleraNodeLayout, rootPassword: string, size: number, timeoutMs = 180_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last: NodeState | undefined;
  while (Date.now() < deadline) {
    last = await nodeState(node, rootPassword);
    if (last && last.ready && last.state === 'Synced' && last.clusterSize >= size) return;
    await sleep(300);
  }
  const logFile = join(node.dir, 'mariadbd.log');
  const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').slice(-2000) : '';
  throw new Error(`${node.name} (127.0.0.1:${node.sqlPort}) is not synced in a cluster of ${size} (last seen: ${JSON.stringify(last)}). Its log ends:\n${tail}`);
}

/** Stops the node: SIGTERM (a clean leave), or SIGKILL with `kill` (a crash, for the tests). */
export async function stopNode(node: GaleraNodeLayout, { kill = false } = {}): Promise<boolean> {
  const pid = nodePid(node);
  if (!pid) return false;
  process.kill(pid, kill ? 'SIGKILL' : 'SIGTERM');
  const deadline = Date.now() + 60_000;
  while (isAlive(pid) && Date.now() < deadline) await sleep(100);
  if (isAlive(pid)) process.kill(pid, 'SIGKILL');
  while (isAlive(pid)) await sleep(50);
  return true;
}
