/**
 * The programs the local cluster needs, installed from Debian's packages with apt-get when they
 * are missing and we may (root, apt-get present), as `ensureMariadbInstalled` does for MariaDB.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { findProgram } from '../instance';

export interface Needed {
  /** A program on PATH, or an absolute file path. */
  file: string;
  /** The Debian package that provides it. */
  debianPackage: string;
}

/** The Galera provider library of Debian's `galera-4`. */
export const GALERA_PROVIDER = '/usr/lib/galera/libgalera_smm.so';

/** What the cluster scripts run: the provider, the rsync state transfer (rsync, ss) and nginx. */
export const CLUSTER_NEEDS: Needed[] = [
  { file: GALERA_PROVIDER, debianPackage: 'galera-4' },
  { file: 'wsrep_sst_rsync', debianPackage: 'mariadb-server' },
  { file: 'rsync', debianPackage: 'rsync' },
  { file: 'ss', debianPackage: 'iproute2' },
  { file: 'nginx', debianPackage: 'nginx' },
];

function present(file: string): boolean {
  return file.startsWith('/') ? existsSync(file) : findProgram(file) !== undefined;
}

/** Installs the packages of whatever in `needs` is missing; throws a clear sentence when it cannot. */
export function ensureDebianPackages(needs: Needed[], log: (line: string) => void = console.log): void {
  const missing = [...new Set(needs.filter((need) => !present(need.file)).map((need) => need.debianPackage))];
  if (missing.length === 0) return;
  const aptGet = findProgram('apt-get');
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!aptGet || !isRoot) {
    throw new Error(`The local cluster needs the Debian packages ${missing.join(', ')}; install them (apt-get install ${missing.join(' ')}) and run again.`);
  }
  log(`Installing ${missing.join(', ')} with apt-get (once per machine)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', '--no-install-recommends', ...missing]]) {
    const result = spawnSync(aptGet, args, { stdio: 'inherit', env });
    if (result.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed (exit ${result.status}).`);
  }
  const still = needs.filter((need) => !present(need.file));
  if (still.length) throw new Error(`apt-get ran but ${still.map((need) => need.file).join(', ')} is still missing.`);
}
