/**
 * Benchmark of the envelope sweep (issue 11). Run: `npm run bench coverage`.
 *
 * Prints the median time of one whole `sweepEnvelope` of the demo light twin-jet — every grid
 * point of its declared envelope, takeoff and landing, through the card's own computation and
 * the ordering rules — and of the other demo books for information. Exits with status 1 when the
 * jet's median is not under 2 s (the target for this machine). Median of 9 sweeps after
 * one warm-up; the load average is printed beside the figures (a busy neighbour stretches them).
 */
import { loadavg } from 'node:os';
import * as coverage from '@shared/card/coverage';
import * as demo from '@shared/speed-book/demo-content';
import { revisionContentSchema } from '@shared/speed-book/revision-content';

const { sweepEnvelope } = coverage;
const TARGET_MS = 2000;
const SAMPLES = 9;

function medianSweepMs(make: () => unknown): { medianMs: number; points: number } {
  const content = revisionContentSchema.parse(make());
  let points = sweepEnvelope(content).counts.points; // warm-up
  const samples: number[] = [];
  for (let i = 0; i < SAMPLES; i++) {
    const start = process.hrtime.bigint();
    const report = sweepEnvelope(content);
    samples.push(Number(process.hrtime.bigint() - start) / 1e6);
    if (!report.passes) throw new Error('A demo book does not pass its own envelope sweep.');
    points = report.counts.points;
  }
  samples.sort((a, b) => a - b);
  return { medianMs: samples[(SAMPLES - 1) / 2], points };
}

const jet = medianSweepMs(demo.demoLightTwinJetContent);
console.log(`sweepEnvelope, demo light twin-jet: median ${jet.medianMs.toFixed(0)} ms for ${jet.points} points (target < ${TARGET_MS} ms)`);
for (const [name, make] of [['piston trainer', demo.demoPistonTrainerContent], ['twin turboprop', demo.demoTwinTurbopropContent]] as const) {
  const other = medianSweepMs(make);
  console.log(`sweepEnvelope, demo ${name}: median ${other.medianMs.toFixed(0)} ms for ${other.points} points`);
}
console.log(`load average ${loadavg().map((value) => value.toFixed(2)).join(' ')}`);
if (!(jet.medianMs < TARGET_MS)) {
  console.error(`The demo jet's sweep took ${jet.medianMs.toFixed(0)} ms, not under ${TARGET_MS} ms.`);
  process.exit(1);
}
