/**
 * Benchmark of the public card check, `GET /api/verify/:code` (issue 7). Run:
 * `npm run bench verify` (or `npx tsx test/bench/verify.bench.ts`).
 *
 * A database of its own on the private test instance (`speedwright_bench_verify`, TEST_DB_PORT),
 * migrated and seeded with the demo operators; 500 cards issued through the card log (each
 * re-derived, as a device's report is); then the real server (server/main.ts, production
 * settings, request logs at info, one server process per core through WEB_CONCURRENCY as
 * production runs it) in processes of its own on a loopback port, and autocannon
 * with 10 connections for 10 s after a 2 s warm-up, each connection asking about the 500 codes
 * in turn. Targets: over 1,500 requests/s on average and a 99th-percentile latency under
 * 30 ms, every answer 200. The load average is printed beside the figures: on a shared
 * machine a busy neighbour lowers them.
 */
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { localSecrets, openLocalDatabase, stopLocalInstance } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../server/dev/demo-seed';
import { startFakeSmtp } from '../../server/dev/fake-smtp';
import { recordCardIssue } from '../../server/cards/card-issues.service';
import { loadCardSource } from '../../server/cards/card-source';
import { createSequelize } from '../../db/connection';
import { AircraftType, Airframe, initModels, Revision, SpeedBook, User } from '../../server/models';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { freePort, stopProcess, waitUntilHealthy } from '../support/app-server';

// autocannon ships no types; the part of its API used here.
interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number; max: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
type Autocannon = (options: Record<string, unknown>) => Promise<AutocannonResult>;
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as Autocannon;

const TARGET_RPS = 1500;
const TARGET_P99_MS = 30;
const CARDS = 500;

async function issueCards(url: string): Promise<string[]> {
  const sequelize = createSequelize(url);
  initModels(sequelize);
  try {
    await createMigrator(sequelize).up();
    await seedDemo(sequelize, 'speedwright-bench-password', { signingKeySecret: localSecrets().signingKeySecret });
    const pilot = await User.findOne({ where: { email: 'pilot@demo.speedwright.example' }, rejectOnEmpty: true });
    const actor = { operatorId: pilot.operatorId, userId: pilot.id, role: pilot.role };
    const type = await AircraftType.findOne({ where: { operatorId: pilot.operatorId, designator: 'ZZP1' }, rejectOnEmpty: true });
    const book = await SpeedBook.findOne({ where: { aircraftTypeId: type.id }, rejectOnEmpty: true });
    const revision = await Revision.findOne({ where: { speedBookId: book.id, status: 'published' }, rejectOnEmpty: true });
    const airframe = await Airframe.findOne({ where: { aircraftTypeId: type.id, active: true }, rejectOnEmpty: true });
    const source = await loadCardSource(actor, revision.id, airframe.id, 'issue');
    const codes: string[] = [];
    for (let i = 0; i < CARDS; i++) {
      // Invented demo data — not for flight.
      const inputs: CardInputs = {
        airframeId: airframe.id,
        weightKg: 900 + (i % 100),
        configuration: 'takeoff-flap',
        departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
        isaDeviationC: 3,
        cruise: { iasKt: 110 },
        altitudeStepFt: 2000,
      };
      const digest = buildCard(source.revision, inputs, source.context).digest;
      const result = await recordCardIssue(actor, { id: randomUUID(), airframeId: airframe.id, revisionId: revision.id, inputs, digest, issuedAt: new Date().toISOString() });
      if (result.outcome !== 'recorded') throw new Error(`Card ${i} was not recorded: ${result.error.message}`);
      codes.push(result.code);
    }
    return codes;
  } finally {
    await sequelize.close();
  }
}

/** CPU time (user + system) of a process so far, ms, from /proc (Linux); null elsewhere. */
/** CPU time (ms) of a process and of its live child processes (the cluster's workers). */
function serverCpuMs(pid: number | undefined): number | null {
  const own = (id: number | string): number => {
    const fields = readFileSync(`/proc/${id}/stat`, 'utf8').split(') ')[1]!.split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100; // USER_HZ is 100 on Linux
  };
  try {
    const children = readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8').trim().split(/\s+/).filter(Boolean);
    return own(pid!) + children.reduce((sum, child) => sum + own(child), 0);
  } catch {
    return null;
  }
}

async function main(): Promise<number> {
  const { url, instance } = await openLocalDatabase('test', 'speedwright_bench_verify', { fresh: true });
  const codes = await issueCards(url);
  const port = await freePort();
  // Production's configuration check wants a mail server; the card check sends no mail.
  const smtp = await startFakeSmtp({ dir: join(projectRoot, '.data', 'mailbox-bench-verify') });
  const server = spawn(process.execPath, ['--import', 'tsx', join(projectRoot, 'server/main.ts')], {
    cwd: projectRoot,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: url,
      SESSION_SECRET: localSecrets().sessionSecret,
      SIGNING_KEY_SECRET: localSecrets().signingKeySecret,
      PUBLIC_URL: `http://localhost:${port}`,
      SMTP_URL: smtp.url,
      MAIL_FROM: 'Speedwright <speedwright@fleet.example>',
      LOG_LEVEL: 'info',
      // One server process per core, as production runs it (WEB_CONCURRENCY, README).
      WEB_CONCURRENCY: String(availableParallelism()),
    },
  });
  const base = `http://127.0.0.1:${port}`;
  try {
    await waitUntilHealthy(server, base);
    const check = await fetch(`${base}/api/verify/${codes[0]}`);
    const body = (await check.json()) as { status?: string };
    if (body.status !== 'current') throw new Error(`The first code answers ${JSON.stringify(body)}, not current.`);

    // Each connection walks the 500 codes in turn (autocannon repeats the sequence), requests prepared once.
    const requests = codes.map((code) => ({ method: 'GET', path: `/api/verify/${code}` }));
    await autocannon({ url: base, connections: 10, duration: 2, requests });
    const cpuBefore = serverCpuMs(server.pid);
    const result = await autocannon({ url: base, connections: 10, duration: 10, requests });
    const cpuAfter = serverCpuMs(server.pid);

    const load = loadavg().map((value) => value.toFixed(2)).join(' ');
    console.log(`GET /api/verify/:code, ${CARDS} codes, 10 connections, 10 s (load average ${load})`);
    console.log(`  requests/s  average ${result.requests.average.toFixed(0)} (target > ${TARGET_RPS}), total ${result.requests.total}`);
    console.log(`  latency ms  p50 ${result.latency.p50}, p99 ${result.latency.p99} (target < ${TARGET_P99_MS}), max ${result.latency.max}`);
    console.log(`  non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}`);
    if (cpuBefore !== null && cpuAfter !== null) {
      // For information: what one answer costs the server process, less dependent on neighbours than the rate.
      const perAnswerUs = ((cpuAfter - cpuBefore) * 1000) / result.requests.total;
      console.log(`  server CPU per answer ${perAnswerUs.toFixed(0)} µs (all server processes; one free core would give about ${Math.floor(1e6 / perAnswerUs)} answers/s)`);
    }
    const ok = result.requests.average > TARGET_RPS && result.latency.p99 < TARGET_P99_MS && result.non2xx === 0 && result.errors === 0 && result.timeouts === 0;
    console.log(ok ? 'Target met.' : 'Target MISSED.');
    return ok ? 0 : 1;
  } finally {
    await stopProcess(server);
    await smtp.stop();
    if (instance.startedHere) await stopLocalInstance('test');
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error);
    process.exit(1);
  },
);
