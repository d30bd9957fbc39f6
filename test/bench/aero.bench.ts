/**
 * Benchmark of the flight-physics library (issue 3). Run: `npx tsx test/bench/aero.bench.ts`.
 *
 * Prints the median time of one `convertAirspeed` call, of one full altitude table (40 pressure
 * altitudes × 3 ISA deviations; each row IAS → CAS through a position-error table, then CAS, EAS,
 * TAS and Mach), and the ratio of the table's time to a bare loop making as many `Math.pow` calls
 * as the table does (counted, not assumed). Exits with status 1 when a target is missed:
 * table under 0.1 ms, ratio under 5.
 *
 * Timing uses process.hrtime.bigint() after a warm-up long enough for the JIT to settle, and
 * reports the median of 2001 samples. A table sample is one table (tens of µs, so the clock's
 * own cost of well under 1 µs hardly counts, and few samples are cut by the scheduler on a busy
 * machine); a `convertAirspeed` sample is a batch of 100 calls. Table and bare-loop samples
 * alternate, so both sides of the ratio see the same conditions.
 */
import * as aero from '@shared/aero';
import type { AirspeedInput, PositionErrorTable } from '@shared/aero';

// Bound once: tsx's CommonJS output would otherwise read each imported name through a getter
// on every call, a cost of the test runner and not of the library (see shared/aero/airspeed.ts).
const { convertAirspeed, iasToCasKt, isaTemperatureC } = aero;

const TABLE_TARGET_MS = 0.1;
const RATIO_TARGET = 5;
const SAMPLES = 2001;

/** Invented demo data — not for flight. */
const POSITION_ERROR: PositionErrorTable = [
  { iasKt: 60, casKt: 64 },
  { iasKt: 90, casKt: 92 },
  { iasKt: 120, casKt: 121 },
  { iasKt: 160, casKt: 160 },
  { iasKt: 200, casKt: 199 },
  { iasKt: 240, casKt: 238 },
  { iasKt: 280, casKt: 277 },
  { iasKt: 320, casKt: 316 },
];
const CRUISE_IAS_KT = 250;
const ALTITUDES_FT = Array.from({ length: 40 }, (_, i) => i * 1000);
const ISA_DEVIATIONS_C = [-15, 0, 15];
const ROWS = ALTITUDES_FT.length * ISA_DEVIATIONS_C.length;

/** Results land here so no work can be optimised away. */
const tableOut = new Float64Array(ROWS * 4);
let sink = 0;

function altitudeTable(): void {
  let row = 0;
  for (let d = 0; d < ISA_DEVIATIONS_C.length; d++) {
    for (let a = 0; a < ALTITUDES_FT.length; a++) {
      const pressureAltitudeFt = ALTITUDES_FT[a];
      const casKt = iasToCasKt(POSITION_ERROR, CRUISE_IAS_KT);
      const speeds = convertAirspeed({ pressureAltitudeFt, oatC: isaTemperatureC(pressureAltitudeFt, ISA_DEVIATIONS_C[d]), casKt });
      const at = row * 4;
      tableOut[at] = speeds.casKt;
      tableOut[at + 1] = speeds.easKt;
      tableOut[at + 2] = speeds.tasKt;
      tableOut[at + 3] = speeds.mach;
      row++;
    }
  }
}

/** Counts the `Math.pow` calls of one run of `work` (and, for information, the other transcendental calls). */
function countCalls(work: () => void): { pow: number; other: number } {
  const math = Math as unknown as Record<string, (...args: number[]) => number>;
  const names = ['pow', 'exp', 'log', 'expm1', 'log1p'];
  const originals = names.map((name) => math[name]);
  const counts: Record<string, number> = {};
  names.forEach((name, i) => {
    counts[name] = 0;
    math[name] = (...args: number[]) => {
      counts[name]++;
      return originals[i](...args);
    };
  });
  try {
    work();
  } finally {
    names.forEach((name, i) => (math[name] = originals[i]));
  }
  return { pow: counts.pow, other: counts.exp + counts.log + counts.expm1 + counts.log1p };
}

function median(times: Float64Array): number {
  const sorted = times.slice().sort();
  const n = sorted.length;
  return n % 2 ? sorted[(n - 1) / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
}

/** Time of one run of `work`, ms, averaged over a batch of `batch` runs. */
function sampleMs(work: () => void, batch: number): number {
  const start = process.hrtime.bigint();
  for (let b = 0; b < batch; b++) work();
  return Number(process.hrtime.bigint() - start) / 1e6 / batch;
}

/**
 * Median times of one run of each of `works`, ms: `samples` rounds, each round taking one
 * batched sample of every work in turn, after a warm-up of all of them.
 */
function medianMs(works: ReadonlyArray<() => void>, batch: number, samples: number, warmupMs = 500): number[] {
  const warmupEnd = process.hrtime.bigint() + BigInt(warmupMs * 1e6);
  while (process.hrtime.bigint() < warmupEnd) for (const work of works) work();
  const times = works.map(() => new Float64Array(samples));
  for (let s = 0; s < samples; s++) works.forEach((work, w) => (times[w][s] = sampleMs(work, batch)));
  return times.map(median);
}

// --- one convertAirspeed call, inputs prepared outside the timed loop ---
const singleInputs: AirspeedInput[] = ALTITUDES_FT.map((pressureAltitudeFt, i) => ({
  pressureAltitudeFt,
  oatC: isaTemperatureC(pressureAltitudeFt, 5),
  casKt: 200 + i,
}));
let nextInput = 0;
function oneConversion(): void {
  sink += convertAirspeed(singleInputs[nextInput]).tasKt;
  nextInput = (nextInput + 1) % singleInputs.length;
}

// --- bare loop: the same number of Math.pow calls on varied, precomputed operands ---
const { pow: powCalls, other: otherCalls } = countCalls(altitudeTable);
const bases = new Float64Array(powCalls).map((_, i) => 0.2 + (i % 97) * 0.01);
const exponents = new Float64Array(powCalls).map((_, i) => [5.25588, 3.5, 2 / 7][i % 3]);
function barePowLoop(): void {
  let total = 0;
  for (let i = 0; i < powCalls; i++) total += Math.pow(bases[i], exponents[i]);
  sink += total;
}

const [conversionMs] = medianMs([oneConversion], 100, SAMPLES);
const [tableMs, bareMs] = medianMs([altitudeTable, barePowLoop], 1, SAMPLES);
const ratio = tableMs / bareMs;

const tableMet = tableMs < TABLE_TARGET_MS;
const ratioMet = ratio < RATIO_TARGET;
const verdict = (met: boolean) => (met ? 'met' : 'MISSED');

console.log(`flight-physics benchmark (node ${process.version}, median of ${SAMPLES} samples)`);
console.log(`  one convertAirspeed call          ${(conversionMs * 1e6).toFixed(0)} ns`);
console.log(
  `  altitude table (${ALTITUDES_FT.length} alt × ${ISA_DEVIATIONS_C.length} ISA dev = ${ROWS} rows)  ` +
    `${(tableMs * 1000).toFixed(2)} µs   target < ${TABLE_TARGET_MS} ms: ${verdict(tableMet)}`,
);
console.log(`  bare loop of ${powCalls} Math.pow calls   ${(bareMs * 1000).toFixed(2)} µs  (the table also makes ${otherCalls} exp/log calls)`);
console.log(`  ratio table / bare loop           ${ratio.toFixed(2)}   target < ${RATIO_TARGET}: ${verdict(ratioMet)}`);
if (!Number.isFinite(sink) || !Number.isFinite(tableOut[ROWS * 4 - 1])) console.log('  (results not finite: check the library)');

if (!tableMet || !ratioMet || !Number.isFinite(sink)) process.exitCode = 1;
