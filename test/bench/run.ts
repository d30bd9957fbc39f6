/**
 * `npm run bench`: every benchmark in this folder (`*.bench.ts`), one process each so that
 * none warms the JIT for another. Each prints its figures and exits non-zero when it misses
 * a target; this runner exits non-zero when any did. The Chromium ones (`*.browser.bench.ts`)
 * need the production build: the runner builds it first unless SKIP_BUILD=1. `npm run bench NAME`
 * runs those whose file name contains NAME; scale.bench.ts runs only so (`npm run bench:scale`).
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';

const dir = __dirname;
const only = process.argv[2];
const benches = readdirSync(dir)
  .filter((name) => name.endsWith('.bench.ts'))
  // The cost of growth (scale.bench.ts, about 15 minutes) runs only when named: `npm run bench:scale`.
  .filter((name) => (only ? name.includes(only) : name !== 'scale.bench.ts'))
  .sort();

// Benchmarks that drive Chromium (`*.browser.bench.ts`) run against the production build.
if (benches.some((name) => name.endsWith('.browser.bench.ts')) && process.env['SKIP_BUILD'] !== '1') {
  console.log('\u203a Building the web app (production) for the Chromium benchmarks (SKIP_BUILD=1 skips)');
  const build = spawnSync(process.execPath, [join(dir, '..', '..', 'node_modules/@angular/cli/bin/ng.js'), 'build'], { stdio: 'inherit', env: { ...process.env, NG_BUILD_OPTIMIZE_CHUNKS: '1' } });
  if (build.status !== 0) process.exit(1);
}

let failed = 0;
for (const name of benches) {
  console.log(`\n=== ${name}`);
  const result = spawnSync(process.execPath, ['--import', 'tsx', join(dir, name)], { stdio: 'inherit' });
  if (result.status !== 0) failed++;
}
console.log(`\n${benches.length - failed} of ${benches.length} benchmarks met their targets.`);
process.exit(failed === 0 ? 0 : 1);
