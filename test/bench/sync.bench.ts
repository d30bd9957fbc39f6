/**
 * Benchmark of `GET /api/sync` (issue 6). Run: `npx tsx test/bench/sync.bench.ts`.
 *
 * Builds a generated operator in a database of its own on the private test instance
 * (`speedwright_bench_sync`, recreated each run): 12 aircraft types with 25 airframes each
 * (300 airframes) and a speed book per type with 5 revisions (60 revisions: each book's last one
 * published, the others superseded), all written, submitted and approved through the same
 * services as the API, so every revision is really signed. Then, as that operator's pilot over
 * loopback HTTP with `Accept-Encoding: gzip`:
 *
 * - a full sync (no cursor): median time of 15 requests and the size of the gzip body on the
 *   wire; targets under 1 s and under 400 kB;
 * - a sync with nothing changed (the cursor the full sync answered): median of 100 requests;
 *   target under 20 ms.
 *
 * The generated books repeat the three demo contents, which gzip finds again and again, so the
 * wire size is far below what real books would give; the uncompressed JSON is printed too and is
 * itself under the size target.
 *
 * Times are wall-clock from the request's start to the last byte, measured with
 * process.hrtime.bigint(); they include the loopback round trip, the session lookup and gzip,
 * which is what a device waits for. The load average is printed beside the figures.
 */
import type { AddressInfo } from 'node:net';
import { loadavg } from 'node:os';
import { pino } from 'pino';
import { call, cookiesOf, median, type Answer } from './timed-http';
import { openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedOperators, type SeedOperator, type SeedType } from '../../server/dev/demo-seed';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../db/connection';
import { initModels } from '../../server/models';
import { demoLightTwinJetContent, demoPistonTrainerContent, demoPistonTrainerContentRevised, demoTwinTurbopropContent } from '@shared/speed-book/demo-content';
import type { RevisionContent } from '@shared/speed-book/revision-content';

const FULL_TARGET_MS = 1000;
const FULL_TARGET_BYTES = 400_000;
const UNCHANGED_TARGET_MS = 20;
const TYPES = 12;
const AIRFRAMES_PER_TYPE = 25;
const REVISIONS_PER_BOOK = 5;
const PASSWORD = 'bench-password-not-for-use';
const SIGNING_KEY_SECRET = 'bench-signing-key-secret-0123456789-abcdefghij';

/** The three kinds of invented type, each with the content its demo type carries. */
const KINDS: { category: SeedType['category']; engines: number; ceilingFt: number; contents: (() => RevisionContent)[] }[] = [
  { category: 'piston-single', engines: 1, ceilingFt: 14000, contents: [demoPistonTrainerContent, demoPistonTrainerContentRevised] },
  { category: 'turboprop', engines: 2, ceilingFt: 30000, contents: [demoTwinTurbopropContent] },
  { category: 'jet', engines: 2, ceilingFt: 41000, contents: [demoLightTwinJetContent] },
];

/** Invented benchmark data — not for flight. */
function generatedOperator(): SeedOperator {
  const fleet: SeedType[] = [];
  for (let t = 0; t < TYPES; t++) {
    const kind = KINDS[t % KINDS.length]!;
    const designator = `ZZB${String(t + 1).padStart(2, '0')}`;
    fleet.push({
      designator,
      name: `Bench type ${t + 1} (generated)`,
      category: kind.category,
      engines: kind.engines,
      ceilingFt: kind.ceilingFt,
      airframes: Array.from({ length: AIRFRAMES_PER_TYPE }, (_, a) => ({
        registration: `ZZ-${String.fromCharCode(65 + t)}${String.fromCharCode(65 + Math.floor(a / 26))}${String.fromCharCode(65 + (a % 26))}`,
        serial: `${designator}-${String(a + 1).padStart(4, '0')}`,
      })),
      speedBook: {
        title: `${designator} speed book`,
        revisions: Array.from({ length: REVISIONS_PER_BOOK }, (_, r) => ({
          content: kind.contents[r % kind.contents.length]!(),
          changeSummary: `Generated revision ${r + 1} (invented benchmark data — not for flight).`,
        })),
      },
    });
  }
  return {
    slug: 'bench-sync',
    name: 'Wrenmoor Freight (generated benchmark operator)',
    people: [
      { email: 'pilot@bench.speedwright.example', displayName: 'Bench Pilot', role: 'pilot' },
      { email: 'engineer@bench.speedwright.example', displayName: 'Bench Engineer', role: 'engineer' },
      { email: 'approver@bench.speedwright.example', displayName: 'Bench Approver', role: 'approver' },
    ],
    fleet,
  };
}

async function main(): Promise<void> {
  const local = await openLocalDatabase('test', 'speedwright_bench_sync', { fresh: true });
  const sequelize = createSequelize(local.url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  const seeded = process.hrtime.bigint();
  await seedOperators(sequelize, [generatedOperator()], PASSWORD, { signingKeySecret: SIGNING_KEY_SECRET });
  console.log(`seeded ${TYPES * AIRFRAMES_PER_TYPE} airframes and ${TYPES * REVISIONS_PER_BOOK} revisions in ${(Number(process.hrtime.bigint() - seeded) / 1e9).toFixed(1)} s`);

  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: local.url,
    SESSION_SECRET: 'bench-session-secret-that-is-long-enough-0123456789',
    SIGNING_KEY_SECRET,
    LOG_LEVEL: 'silent',
    APP_DIST: 'dist/app/browser',
  });
  const { app, close } = createApp({ config, sequelize, logger: pino({ level: 'silent' }) });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;

  const jar = new Map<string, string>();
  const cookie = () => ({ cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; ') });
  const csrf = await call(port, 'GET', '/api/auth/csrf', {});
  cookiesOf(csrf, jar);
  const login = await call(
    port,
    'POST',
    '/api/auth/login',
    { ...cookie(), 'content-type': 'application/json', 'x-csrf-token': (JSON.parse(csrf.body) as { token: string }).token },
    JSON.stringify({ email: 'pilot@bench.speedwright.example', password: PASSWORD }),
  );
  if (login.status !== 200) throw new Error(`The bench pilot could not sign in: ${login.status} ${login.body}`);
  cookiesOf(login, jar);

  const full: Answer[] = [];
  for (let i = 0; i < 16; i++) full.push(await call(port, 'GET', '/api/sync', cookie()));
  full.shift(); // the first warms the JIT and the connection pool
  const first = full[0]!;
  if (first.status !== 200) throw new Error(`Full sync answered ${first.status}: ${first.body.slice(0, 300)}`);
  const answer = JSON.parse(first.body) as { cursor: string; airframes: unknown[]; revisions: unknown[] };
  if (answer.airframes.length !== TYPES * AIRFRAMES_PER_TYPE || answer.revisions.length !== TYPES * REVISIONS_PER_BOOK) {
    throw new Error(`Full sync gave ${answer.airframes.length} airframes and ${answer.revisions.length} revisions`);
  }
  const cursor = encodeURIComponent(answer.cursor);
  const unchanged: Answer[] = [];
  for (let i = 0; i < 110; i++) unchanged.push(await call(port, 'GET', `/api/sync?cursor=${cursor}`, cookie()));
  unchanged.splice(0, 10);
  const sample = JSON.parse(unchanged[0]!.body) as { cursor: string; airframes: unknown[]; revisions: unknown[]; aircraftTypes: unknown[] };
  if (sample.cursor !== answer.cursor || sample.airframes.length + sample.revisions.length + sample.aircraftTypes.length !== 0) {
    throw new Error('A sync with nothing changed did not answer empty lists and the same cursor');
  }

  const fullMs = median(full.map((a) => a.ms));
  const unchangedMs = median(unchanged.map((a) => a.ms));
  const bytes = first.wireBytes;
  console.log(`load average ${loadavg().map((v) => v.toFixed(2)).join(' ')}`);
  console.log(`full sync: median ${fullMs.toFixed(1)} ms (target < ${FULL_TARGET_MS} ms), ${(bytes / 1000).toFixed(1)} kB gzip on the wire (target < ${FULL_TARGET_BYTES / 1000} kB), ${(first.body.length / 1000).toFixed(0)} kB JSON`);
  console.log(`sync with nothing changed: median ${unchangedMs.toFixed(2)} ms (target < ${UNCHANGED_TARGET_MS} ms)`);

  server.close();
  await close();
  await sequelize.close();
  const missed = fullMs >= FULL_TARGET_MS || bytes >= FULL_TARGET_BYTES || unchangedMs >= UNCHANGED_TARGET_MS || first.headers['content-encoding'] !== 'gzip';
  if (first.headers['content-encoding'] !== 'gzip') console.log('The full sync was not sent gzip-compressed.');
  process.exit(missed ? 1 : 0);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
