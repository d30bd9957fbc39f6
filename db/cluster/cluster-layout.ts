/**
 * Where the local Galera cluster lives and which ports it uses. Every port can be moved with an
 * environment variable so several checkouts (or a system MariaDB) can run beside it; every file
 * is under `.data/cluster/`, nothing touches the machine's global configuration.
 */
import { join } from 'node:path';
import { projectRoot } from '../instance';

export interface GaleraNodeLayout {
  /** 1, 2 or 3. */
  index: number;
  name: string;
  /** Holds `my.cnf`, `data/`, `sock`, `pid` and `mariadbd.log`. */
  dir: string;
  sqlPort: number;
  /** Group communication (gmcast.listen_addr). */
  groupPort: number;
  /** Incremental state transfer (ist.recv_addr). */
  istPort: number;
  /** Full state transfer (wsrep_sst_receive_address, the rsync daemon of a joiner). */
  sstPort: number;
}

export interface AppInstanceLayout {
  index: number;
  dir: string;
  port: number;
  /** The Galera node this instance writes to. */
  node: GaleraNodeLayout;
}

export interface ClusterLayout {
  dir: string;
  nodes: GaleraNodeLayout[];
  apps: AppInstanceLayout[];
  balancerPort: number;
  nginxDir: string;
  /** Uploaded source pages, shared by the instances of this one machine. */
  attachmentsDir: string;
  database: string;
}

function port(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1 || value > 65535) throw new Error(`${name} must be a port number, not "${raw}".`);
  return value;
}

/** How many Speedwright server processes stand behind the load balancer (2 or 3; 3 by default). */
function appCount(): number {
  const raw = process.env['CLUSTER_APP_INSTANCES'];
  if (raw === undefined || raw === '') return 3;
  const value = Number(raw);
  if (value !== 2 && value !== 3) throw new Error(`CLUSTER_APP_INSTANCES must be 2 or 3, not "${raw}".`);
  return value;
}

/**
 * The layout from the environment. Defaults: SQL 4671–4673, group 4681–4683, IST 4691–4693,
 * SST 4694–4696, instances 4676–4678, load balancer 4670 (CLUSTER_*_PORT_1…3 move each one).
 */
export function clusterLayout(): ClusterLayout {
  const dir = join(projectRoot, '.data', 'cluster');
  const nodes = [1, 2, 3].map((index) => ({
    index,
    name: `node${index}`,
    dir: join(dir, `node${index}`),
    sqlPort: port(`CLUSTER_SQL_PORT_${index}`, 4670 + index),
    groupPort: port(`CLUSTER_GROUP_PORT_${index}`, 4680 + index),
    istPort: port(`CLUSTER_IST_PORT_${index}`, 4690 + index),
    sstPort: port(`CLUSTER_SST_PORT_${index}`, 4693 + index),
  }));
  const apps = Array.from({ length: appCount() }, (_unused, i) => ({
    index: i + 1,
    dir: join(dir, `app${i + 1}`),
    port: port(`CLUSTER_APP_PORT_${i + 1}`, 4676 + i),
    node: nodes[i % nodes.length]!,
  }));
  return {
    dir,
    nodes,
    apps,
    balancerPort: port('CLUSTER_LB_PORT', 4670),
    nginxDir: join(dir, 'nginx'),
    attachmentsDir: join(dir, 'attachments'),
    database: 'speedwright',
  };
}
