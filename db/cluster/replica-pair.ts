/**
 * A primary and one read replica with MariaDB's ordinary (asynchronous, GTID) replication on
 * loopback, under `.data/cluster/replica-primary/` and `.data/cluster/replica/` — what
 * DATABASE_READ_URLS is for. Set up as MariaDB's "Setting Up Replication" describes: the primary
 * keeps a binary log and has a replication user; the replica starts from the primary's current
 * GTID position and is read-only.
 *
 * Ports: REPLICA_PRIMARY_PORT (4674) and REPLICA_PORT (4675).
 */
import { join } from 'node:path';
import { createDatabase, rootConnection, startInstance, stopInstance, type InstanceSpec, type RunningInstance } from '../instance';
import { localSecrets } from '../local';
import { clusterLayout } from './cluster-layout';

export interface ReplicaPair {
  primary: RunningInstance;
  replica: RunningInstance;
  primaryUrl: string;
  replicaUrl: string;
}

function specs(): { primary: InstanceSpec; replica: InstanceSpec } {
  const { dir } = clusterLayout();
  const rootPassword = localSecrets().rootPassword;
  const port = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
  return {
    primary: { dir: join(dir, 'replica-primary'), port: port('REPLICA_PRIMARY_PORT', 4674), rootPassword },
    replica: { dir: join(dir, 'replica'), port: port('REPLICA_PORT', 4675), rootPassword },
  };
}

/** The replication account's password: derived from the local secrets, never printed. */
const replicationPassword = () => `repl-${localSecrets().dbPassword}`;

/** Starts both (or reuses them), makes the app database and user, and starts replication. */
export async function startReplicaPair(database: string, log: (line: string) => void = console.log): Promise<ReplicaPair> {
  const spec = specs();
  const common = ['--binlog-format=ROW', '--log-bin-trust-function-creators=1'];
  const primary = await startInstance(spec.primary, log, [...common, '--server-id=1', `--log-bin=${join(spec.primary.dir, 'binlog')}`]);
  const replica = await startInstance(spec.replica, log, [...common, '--server-id=2', '--read-only=1', '--skip-slave-start']);

  const onPrimary = await rootConnection(primary);
  let position: string;
  try {
    await onPrimary.query("CREATE USER IF NOT EXISTS 'replication'@'127.0.0.1' IDENTIFIED BY ?", [replicationPassword()]);
    await onPrimary.query("GRANT REPLICATION SLAVE ON *.* TO 'replication'@'127.0.0.1'");
    position = ((await onPrimary.query('SELECT @@GLOBAL.gtid_binlog_pos AS pos')) as { pos: string }[])[0]!.pos;
  } finally {
    await onPrimary.end();
  }

  const onReplica = await rootConnection(replica);
  try {
    const status = (await onReplica.query('SHOW SLAVE STATUS')) as { Slave_IO_Running?: string }[];
    if (status.length === 0) {
      // A new replica: it already has what the primary had when both were made (the system
      // tables, root's password); it replicates everything after the primary's position now.
      await onReplica.query('SET GLOBAL gtid_slave_pos = ?', [position]);
      await onReplica.query(
        `CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${primary.port}, MASTER_USER='replication', MASTER_PASSWORD=?, MASTER_USE_GTID=slave_pos`,
        [replicationPassword()],
      );
    }
    await onReplica.query('START SLAVE');
  } finally {
    await onReplica.end();
  }
  const primaryUrl = await createDatabase(primary, database, 'speedwright', localSecrets().dbPassword);
  const replicaUrl = primaryUrl.replace(`:${primary.port}/`, `:${replica.port}/`);
  return { primary, replica, primaryUrl, replicaUrl };
}

/** Pauses or resumes the replica's applier (the tests' way to make it lag). */
export async function setReplicating(pair: ReplicaPair, on: boolean): Promise<void> {
  const conn = await rootConnection(pair.replica);
  try {
    await conn.query(on ? 'START SLAVE' : 'STOP SLAVE SQL_THREAD');
  } finally {
    await conn.end();
  }
}

/** Waits until the replica has applied everything the primary has logged. */
export async function waitReplicaCaughtUp(pair: ReplicaPair, timeoutMs = 30_000): Promise<void> {
  const primary = await rootConnection(pair.primary);
  const replica = await rootConnection(pair.replica);
  try {
    const target = ((await primary.query('SELECT @@GLOBAL.gtid_binlog_pos AS pos')) as { pos: string }[])[0]!.pos;
    const [row] = (await replica.query('SELECT MASTER_GTID_WAIT(?, ?) AS waited', [target, timeoutMs / 1000])) as { waited: number }[];
    if (Number(row!.waited) !== 0) throw new Error(`The replica did not reach the primary's position ${target} in ${timeoutMs / 1000} s.`);
  } finally {
    await primary.end();
    await replica.end();
  }
}

export async function stopReplicaPair(): Promise<void> {
  const spec = specs();
  await stopInstance(spec.replica);
  await stopInstance(spec.primary);
}
