/**
 * `npm run bench`: every benchmark in this folder (`*.bench.ts`), one process each so that
 * none warms the JIT for another. Each prints its figures and exits non-zero when it misses
 * a target; this runner exits non-zero when any did.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';

const dir = __dirname;
const only = process.argv[2];
const benches = readdirSync(dir)
  .filter((name) => name.endsWith('.bench.ts'))
  .filter((name) => !only || name.includes(only))
  .sort();

let failed = 0;
for (const name of benches) {
  console.log(`\n=== ${name}`);
  const result = spawnSync(process.execPath, ['--import', 'tsx', join(dir, name)], { stdio: 'inherit' });
  if (result.status !== 0) failed++;
}
console.log(`\n${benches.length - failed} of ${benches.length} benchmarks met their targets.`);
process.exit(failed === 0 ? 0 : 1);
