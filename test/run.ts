/**
 * `npm test`: every test. First the static checks — `npm run lint` (eslint with the import
 * boundaries) and `npm run typecheck` (server, app and the two purity tsconfigs); either failing
 * ends the run. Then installs what the tests need from Debian when it is missing
 * (mariadb-server, chromium), starts the private test MariaDB instance, builds for production
 * (`npm run build`: the web app, then the server into dist/server/), and runs the jest projects
 * in three phases: the shared library, the client and the API against real MariaDB together;
 * end-to-end in Chromium alone; then the production path (`test/production/`: that same build
 * installed with production dependencies only, `npm run serve` against a fresh database); then
 * the cluster (`npm run test:cluster`: three Galera nodes and a replica pair, the same build).
 * `--e2e-only` and `--production-only` (`npm run test:e2e`, `npm run test:production`) run one
 * of the last two alone (no static checks); other arguments go to one jest run as given.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { ensureMariadbInstalled, projectRoot } from '../db/instance';
import { openLocalDatabase, stopLocalInstance } from '../db/local';
import { CHROMIUM_PATH } from './e2e/browser';
import { REUSE_BUILD_VARIABLE } from './production/reuse-build';

function ensureChromium(): void {
  if (existsSync(CHROMIUM_PATH)) return;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot) throw new Error(`Chromium is missing at ${CHROMIUM_PATH}; install the Debian package chromium (apt-get needs root).`);
  console.log('Installing chromium with apt-get (once per machine)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'chromium']]) {
    if (spawnSync('apt-get', args, { stdio: 'inherit', env }).status !== 0) throw new Error(`apt-get ${args.join(' ')} failed.`);
  }
}

function run(args: string[]): number {
  // NG_BUILD_OPTIMIZE_CHUNKS: the build as `npm run build` makes it (DEVELOPERS.md, "A fast first visit").
  // The production tests use the build made here rather than building again.
  const result = spawnSync(process.execPath, args, {
    cwd: projectRoot,
    stdio: 'inherit',
    env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_BUILD_OPTIMIZE_CHUNKS: '1', [REUSE_BUILD_VARIABLE]: '1' },
  });
  return result.status ?? 1;
}

/** The static checks of package.json's `lint` and `typecheck` scripts; 0 when both pass. */
function staticChecks(): number {
  for (const script of ['lint', 'typecheck']) {
    console.log(`\u203a npm run ${script}`);
    const result = spawnSync('npm', ['run', '--silent', script], { cwd: projectRoot, stdio: 'inherit' });
    if (result.status !== 0) {
      console.error(`npm run ${script} failed; the tests do not run until it passes.`);
      return result.status ?? 1;
    }
  }
  return 0;
}

async function main(): Promise<number> {
  const e2eOnly = process.argv.includes('--e2e-only');
  const productionOnly = process.argv.includes('--production-only');
  if (!e2eOnly && !productionOnly) {
    const checks = staticChecks();
    if (checks !== 0) return checks;
  }
  ensureMariadbInstalled();
  if (!productionOnly) ensureChromium();
  const { instance } = await openLocalDatabase('test', 'speedwright_api_test');
  try {
    console.log('\u203a Building for production (the web app, then the server) for the end-to-end and production tests');
    if (run([join(projectRoot, 'node_modules/@angular/cli/bin/ng.js'), 'build']) !== 0) return 1;
    if (run([join(projectRoot, 'node_modules/tsx/dist/cli.mjs'), join(projectRoot, 'tools/build-server.ts')]) !== 0) return 1;
    const jest = [join(projectRoot, 'node_modules/jest/bin/jest.js'), '--ci'];
    const extra = process.argv.slice(2).filter((arg) => arg !== '--e2e-only' && arg !== '--production-only');
    if (e2eOnly) return run([...jest, '--selectProjects', 'e2e', ...extra]);
    if (productionOnly) return run([...jest, '--selectProjects', 'production', ...extra]);
    if (extra.length > 0) return run([...jest, ...extra]);
    // Unit and API tests first, then the end-to-end tests on their own: beside argon2 and
    // MariaDB work of the API tests, a browser on a 2-core machine waits long past any sensible
    // timeout. Then the production path, which installs packages and starts servers of its own.
    // Every phase runs, so one report shows every failure.
    const unitAndApi = run([...jest, '--selectProjects', 'shared', 'server', 'client']);
    console.log('\u203a End-to-end tests in Chromium');
    const e2e = run([...jest, '--selectProjects', 'e2e']);
    console.log('\u203a The production path (npm run test:production)');
    const production = run([...jest, '--selectProjects', 'production']);
    // About 70 s on the 2-core machine (README, "Cluster"): three Galera nodes, three instances
    // of the same build behind nginx, and a primary with a replica, all under .data/cluster/.
    console.log('\u203a The cluster (npm run test:cluster)');
    const cluster = run([join(projectRoot, 'node_modules/tsx/dist/cli.mjs'), join(projectRoot, 'test/cluster/run.ts')]);
    return [unitAndApi, e2e, production, cluster].find((code) => code !== 0) ?? 0;
  } finally {
    if (instance.startedHere) await stopLocalInstance('test');
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
