/**
 * `npm run test:cluster`: the product on three MariaDB Galera nodes behind nginx, with the real
 * engine. Starts the local cluster (db/cluster/local-cluster.ts) unless it runs, seeds the
 * invented demo operator, runs each scenario against the load balancer or one instance, and
 * prints `N passed, N failed` and the run time. It stops the cluster if it started it
 * (KEEP_CLUSTER=1 leaves it running).
 */
import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../db/connection';
import { localSecrets } from '../../db/local';
import { join } from 'node:path';
import { clusterLayout } from '../../db/cluster/cluster-layout';
import { setReplicating, startReplicaPair, stopReplicaPair, waitReplicaCaughtUp } from '../../db/cluster/replica-pair';
import { createMigrator } from '../../db/migrator';
import { appPid, startApp, stopApp, waitListening } from '../../db/cluster/app-instances';
import { nodePid, stopNode, waitSynced } from '../../db/cluster/galera-node';
import { startCluster, startNode, stopCluster } from '../../db/cluster/local-cluster';
import { loadCardSource } from '../../server/cards/card-source';
import { DEFAULT_DEMO_PASSWORD, seedDemo } from '../../server/dev/demo-seed';
import { AircraftType, Airframe, initModels, Revision, SpeedBook, User } from '../../server/models';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { MAX_CARD_ISSUES_PER_BATCH } from '@shared/card/card-api';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { ClusterClient } from './http-client';

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));
const email = (role: string) => `${role}@demo.speedwright.example`;

function check(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(message);
}

interface Entry {
  id: string;
  airframeId: number;
  revisionId: number;
  inputs: CardInputs;
  digest: string;
  issuedAt: string;
}

interface World {
  lb: string;
  instanceUrls: string[];
  nodes: Sequelize[];
  /** The demo ZZP1 type's book, whose published revision the card-log entries use. */
  bookId: number;
  /** Card log entries for the demo pilot, re-derivable by the server. */
  entries: (count: number) => Promise<Entry[]>;
}

/** Runs `work` on each node's connection and answers the results in node order. */
const onEveryNode = <T>(world: World, work: (node: Sequelize) => Promise<T>) => Promise.all(world.nodes.map(work));

async function countStored(node: Sequelize, ids: string[]): Promise<{ rows: number; codes: number }> {
  const [row] = await node.query<{ rows: number; codes: number }>('SELECT COUNT(*) AS `rows`, COUNT(DISTINCT code) AS codes FROM card_issues WHERE id IN (?)', {
    replacements: [ids],
    type: QueryTypes.SELECT,
  });
  return { rows: Number(row!.rows), codes: Number(row!.codes) };
}

/** A new aircraft type and speed book of the demo operator, with a submitted revision ready for an approver. */
async function submittedRevision(world: World): Promise<{ id: number; bookId: number }> {
  const admin = new ClusterClient(world.lb);
  const engineer = new ClusterClient(world.lb);
  await Promise.all([admin.signIn(email('admin'), DEFAULT_DEMO_PASSWORD), engineer.signIn(email('engineer'), DEFAULT_DEMO_PASSWORD)]);
  const designator = `C${randomUUID().slice(0, 5).toUpperCase()}`;
  const type = await admin.send('POST', '/api/aircraft-types', { designator, name: 'Cluster test trainer (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 });
  check(type.status === 201, `creating a type answered ${type.status}: ${JSON.stringify(type.body)}`);
  const aircraftTypeId = (type.body as { aircraftType: { id: number } }).aircraftType.id;
  const book = await engineer.send('POST', '/api/speed-books', { aircraftTypeId, title: `Cluster test book ${designator}` });
  check(book.status === 201, `creating a book answered ${book.status}: ${JSON.stringify(book.body)}`);
  const bookId = (book.body as { speedBook: { id: number } }).speedBook.id;
  const draft = await engineer.send('POST', `/api/speed-books/${bookId}/revisions`, { content: demoPistonTrainerContent(), changeSummary: 'Cluster test revision (invented demo data — not for flight)' });
  check(draft.status === 201, `creating a draft answered ${draft.status}: ${JSON.stringify(draft.body)}`);
  const id = (draft.body as { revision: { id: number } }).revision.id;
  const submit = await engineer.send('POST', `/api/revisions/${id}/submit`);
  check(submit.status === 200, `submitting answered ${submit.status}`);
  return { id, bookId };
}

/** On every node: the revision is published, signed, and the only published one of its book. */
async function checkPublishedOnce(world: World, { id: revisionId, bookId }: { id: number; bookId: number }): Promise<void> {
  const views = await onEveryNode(world, (node) =>
    node.query<{ id: number; status: string; signed: number }>(
      'SELECT id, status, signature IS NOT NULL AND content_sha256 IS NOT NULL AND published_at IS NOT NULL AS signed FROM revisions WHERE speed_book_id = ? AND status = ?',
      { replacements: [bookId, 'published'], type: QueryTypes.SELECT },
    ),
  );
  for (const [i, rows] of views.entries()) {
    check(rows.length === 1 && rows[0]!.id === revisionId && Number(rows[0]!.signed) === 1, `node ${i + 1}: published revisions of the book are ${JSON.stringify(rows)}, expected only ${revisionId}, signed`);
  }
}

/** Sends a device's outbox batch until every entry is recorded (as the client's outbox does), at most `tries` times. */
async function deliver(client: ClusterClient, entries: Entry[], base?: string, tries = 10): Promise<Map<string, string>> {
  const codes = new Map<string, string>();
  let last = '';
  for (let attempt = 1; attempt <= tries + Math.ceil(entries.length / MAX_CARD_ISSUES_PER_BATCH) && codes.size < entries.length; attempt++) {
    const waiting = entries.filter((entry) => !codes.has(entry.id)).slice(0, MAX_CARD_ISSUES_PER_BATCH);
    const answer = await client.send('POST', '/api/card-issues', { entries: waiting }, base);
    if (answer.status === 200 || answer.status === 201 || answer.status === 207) {
      for (const result of (answer.body as { results: { id: string; outcome: string; code?: string }[] }).results) {
        if (result.outcome === 'recorded' && result.code) codes.set(result.id, result.code);
        else if (result.outcome !== 'recorded') throw new Error(`entry ${result.id} was ${result.outcome}: ${JSON.stringify(result)}`);
      }
    } else {
      last = `${answer.status} ${JSON.stringify(answer.body).slice(0, 200)}`;
      await sleep(200 * attempt);
    }
  }
  check(codes.size === entries.length, `only ${codes.size} of ${entries.length} entries were delivered (last answer: ${last})`);
  return codes;
}

const scenarios: [string, (world: World) => Promise<void>][] = [
  [
    'sign in through one instance and continue through another',
    async (world) => {
      const pilot = new ClusterClient(world.instanceUrls[0]!);
      await pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD);
      for (const base of world.instanceUrls.slice(1)) {
        const me = await pilot.send('GET', '/api/auth/me', undefined, base);
        check(me.status === 200 && (me.body as { user: { email: string } }).user.email === email('pilot'), `GET /api/auth/me on ${base} answered ${me.status}`);
      }
      // A write with the CSRF token the first instance gave.
      const logout = await pilot.send('POST', '/api/auth/logout', undefined, world.instanceUrls.at(-1));
      check(logout.status === 200 || logout.status === 204, `sign-out on another instance answered ${logout.status}`);
      const after = await pilot.send('GET', '/api/auth/me', undefined, world.instanceUrls[0]);
      check(after.status === 401, `after signing out elsewhere, the first instance answered ${after.status}`);
    },
  ],
  [
    'racing approvals from two instances on two nodes publish exactly once',
    async (world) => {
      const revision = await submittedRevision(world);
      const { id } = revision;
      const [one, two] = [new ClusterClient(world.instanceUrls[0]!), new ClusterClient(world.instanceUrls[1]!)];
      await Promise.all([one.signIn(email('approver'), DEFAULT_DEMO_PASSWORD), two.signIn(email('approver'), DEFAULT_DEMO_PASSWORD)]);
      const answers = await Promise.all([one.send('POST', `/api/revisions/${id}/approve`), two.send('POST', `/api/revisions/${id}/approve`)]);
      const statuses = answers.map((answer) => answer.status).sort();
      check(statuses[0] === 200 && statuses[1] === 409, `the two approvals answered ${statuses.join(' and ')}, expected 200 and 409`);
      await checkPublishedOnce(world, revision);
    },
  ],
  [
    '100 concurrent card-log batches over the instances: each entry stored once, codes unique',
    async (world) => {
      const pilot = new ClusterClient(world.lb);
      await pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD);
      const all = await world.entries(200);
      const batches = Array.from({ length: 100 }, (_unused, i) => all.slice(i * 2, i * 2 + 2));
      const answers = await Promise.all(batches.map((batch) => pilot.send('POST', '/api/card-issues', { entries: batch })));
      const upstreams = new Set(answers.map((answer) => answer.upstream));
      check(answers.every((answer) => answer.status === 201 || answer.status === 200), `statuses: ${[...new Set(answers.map((a) => a.status))].join(', ')}`);
      check(upstreams.size === world.instanceUrls.length, `the batches reached ${upstreams.size} instances`);
      // A replay of every batch answers the same codes and stores nothing new.
      const first = new Map(answers.flatMap((answer) => (answer.body as { results: { id: string; code: string }[] }).results.map((r) => [r.id, r.code] as const)));
      const replay = await deliver(pilot, all);
      check([...replay].every(([id, code]) => first.get(id) === code), 'a replay answered another code');
      for (const [i, stored] of (await onEveryNode(world, (node) => countStored(node, all.map((e) => e.id)))).entries()) {
        check(stored.rows === 200 && stored.codes === 200, `node ${i + 1} holds ${stored.rows} entries with ${stored.codes} codes, expected 200 and 200`);
      }
    },
  ],
  [
    'a device syncing on one node receives a revision published on another',
    async (world) => {
      const pilot = new ClusterClient(world.instanceUrls[2]!);
      await pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD);
      const before = await pilot.send('GET', '/api/sync');
      check(before.status === 200, `sync answered ${before.status}`);
      let cursor = (before.body as { cursor: string }).cursor;
      const { id } = await submittedRevision(world);
      const approver = new ClusterClient(world.instanceUrls[0]!);
      await approver.signIn(email('approver'), DEFAULT_DEMO_PASSWORD);
      // Syncs run while the publication commits on node 1: none may move the cursor past it.
      const syncing = (async () => {
        const seen: number[] = [];
        for (let i = 0; i < 15; i++) {
          const answer = await pilot.send('GET', `/api/sync?cursor=${encodeURIComponent(cursor)}`);
          check(answer.status === 200, `sync answered ${answer.status}`);
          const body = answer.body as { cursor: string; revisions: { id: number }[] };
          seen.push(...body.revisions.map((revision) => revision.id));
          cursor = body.cursor;
          await sleep(40);
        }
        return seen;
      })();
      const approve = await approver.send('POST', `/api/revisions/${id}/approve`);
      check(approve.status === 200, `approval answered ${approve.status}`);
      const seen = await syncing;
      if (!seen.includes(id)) {
        const next = await pilot.send('GET', `/api/sync?cursor=${encodeURIComponent(cursor)}`);
        seen.push(...(next.body as { revisions: { id: number }[] }).revisions.map((revision) => revision.id));
      }
      check(seen.includes(id), `the device never received revision ${id}`);
    },
  ],
  [
    'SIGKILL of a Galera node during a card-log batch and a publication: served on two nodes, rejoins, nothing lost, doubled or half-published',
    async (world) => {
      const layout = clusterLayout();
      const victim = layout.nodes[1]!; // instance 2 writes to it
      const revision = await submittedRevision(world);
      const { id } = revision;
      const approver = new ClusterClient(world.instanceUrls[1]!);
      const pilot = new ClusterClient(world.instanceUrls[1]!);
      await Promise.all([approver.signIn(email('approver'), DEFAULT_DEMO_PASSWORD), pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD)]);
      const entries = await world.entries(60);
      try {
        const inFlight = Promise.all([
          approver.send('POST', `/api/revisions/${id}/approve`, undefined, undefined, 15_000),
          ...[0, 1, 2].map((i) => pilot.send('POST', '/api/card-issues', { entries: entries.slice(i * 20, i * 20 + 20) }, undefined, 15_000)),
        ]);
        await sleep(25);
        await stopNode(victim, { kill: true });
        const [approve, ...batches] = await inFlight;
        console.log(`      (in flight at the kill: approval ${approve.status}, card-log batches ${batches.map((b) => b.status).join(', ')})`);
        // Still served: the two other nodes keep the quorum once they have evicted the dead one
        // (Galera's evs.suspect_timeout, 5 s by default), so the instances on them answer again.
        const killedAt = Date.now();
        for (const base of [world.instanceUrls[0]!, world.instanceUrls[2]!]) {
          let health = await new ClusterClient(base).send('GET', '/api/health');
          while (health.status !== 200 && Date.now() - killedAt < 30_000) {
            await sleep(250);
            health = await new ClusterClient(base).send('GET', '/api/health');
          }
          check(health.status === 200, `${base} health answered ${health.status} 30 s after a node went down`);
        }
        console.log(`      (the two remaining nodes served again ${((Date.now() - killedAt) / 1000).toFixed(1)} s after the kill)`);
        // The clients try again through the load balancer, as the app's outbox and the approver would.
        const again = new ClusterClient(world.lb);
        await again.signIn(email('approver'), DEFAULT_DEMO_PASSWORD);
        if (approve.status !== 200) {
          const retry = await again.send('POST', `/api/revisions/${id}/approve`);
          check(retry.status === 200 || retry.status === 409, `the approval's retry answered ${retry.status}`);
        }
        const device = new ClusterClient(world.instanceUrls[0]!);
        await device.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD);
        await deliver(device, entries);
      } finally {
        // The node comes back and catches up by state transfer.
        await startNode(layout, victim, 3);
        for (const node of layout.nodes) await waitSynced(node, localSecrets().rootPassword, 3);
      }
      await checkPublishedOnce(world, revision);
      for (const [i, stored] of (await onEveryNode(world, (node) => countStored(node, entries.map((e) => e.id)))).entries()) {
        check(stored.rows === 60 && stored.codes === 60, `node ${i + 1} holds ${stored.rows} entries with ${stored.codes} codes, expected 60`);
      }
      await waitListening(layout.apps[1]!);
    },
  ],
  [
    'SIGKILL of a server instance mid-request: nginx retries the reads, the outbox delivers the writes',
    async (world) => {
      const layout = clusterLayout();
      const victim = layout.apps.at(-1)!;
      const pilot = new ClusterClient(world.lb);
      await pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD);
      const entries = await world.entries(40);
      try {
        const reads = Promise.all(Array.from({ length: 30 }, () => pilot.send('GET', '/api/sync')));
        const writes = Promise.all([0, 1, 2, 3].map((i) => pilot.send('POST', '/api/card-issues', { entries: entries.slice(i * 10, i * 10 + 10) })));
        await sleep(30);
        await stopApp(victim, { kill: true });
        const readAnswers = await reads;
        const writeAnswers = await writes;
        const servedBy = new Set(readAnswers.map((answer) => answer.upstream));
        console.log(`      (reads answered by ${[...servedBy].join(' | ')}; card-log batches in flight answered ${writeAnswers.map((a) => a.status).join(', ')})`);
        check(readAnswers.every((answer) => answer.status === 200), `reads answered ${readAnswers.map((a) => a.status).join(',')}`);
        await deliver(pilot, entries);
        const [stored] = await onEveryNode(world, (node) => countStored(node, entries.map((e) => e.id)));
        check(stored!.rows === 40 && stored!.codes === 40, `stored ${stored!.rows} entries with ${stored!.codes} codes, expected 40`);
      } finally {
        startApp(layout, victim, localSecrets());
        await waitListening(victim);
      }
    },
  ],
];

/**
 * Read replicas (README, "Replicated MariaDB"): a primary, one replica, an instance with
 * DATABASE_READ_URLS. With the replica's applier paused (a replica that lags), plain reads
 * answer from the replica, while sessions and the sync cursor come from the primary.
 */
async function replicaScenario(): Promise<void> {
  const layout = clusterLayout();
  const pair = await startReplicaPair(layout.database, () => undefined);
  const primary = createSequelize(pair.primaryUrl);
  const app = { index: 9, dir: join(layout.dir, 'app-replica'), port: Number(process.env['REPLICA_APP_PORT'] ?? 4679), node: layout.nodes[0]! };
  try {
    await createMigrator(primary, undefined).up();
    initModels(primary);
    await seedDemo(primary, DEFAULT_DEMO_PASSWORD, { signingKeySecret: localSecrets().signingKeySecret });
    await waitReplicaCaughtUp(pair);
    startApp(layout, app, localSecrets(), { DATABASE_URL: pair.primaryUrl, DATABASE_READ_URLS: pair.replicaUrl });
    await waitListening(app);
    const base = `http://127.0.0.1:${app.port}`;
    const admin = new ClusterClient(base);
    const pilot = new ClusterClient(base);
    const reader = new ClusterClient(base);
    await Promise.all([pilot.signIn(email('pilot'), DEFAULT_DEMO_PASSWORD), reader.signIn(email('engineer'), DEFAULT_DEMO_PASSWORD)]);
    const before = await pilot.send('GET', '/api/sync');
    check(before.status === 200, `sync answered ${before.status}`);

    await setReplicating(pair, false);
    try {
      // Signed in while the replica lags: the session is read from the primary.
      await admin.signIn(email('admin'), DEFAULT_DEMO_PASSWORD);
      const me = await admin.send('GET', '/api/auth/me');
      check(me.status === 200, `with the replica behind, the new session answered ${me.status}`);
      const designator = `R${randomUUID().slice(0, 5).toUpperCase()}`;
      const made = await admin.send('POST', '/api/aircraft-types', { designator, name: 'Replica test trainer (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 });
      check(made.status === 201, `creating a type answered ${made.status}`);
      const id = (made.body as { aircraftType: { id: number } }).aircraftType.id;
      // The writer reads its own write at once (its session reads from the primary for a while).
      const own = await admin.send('GET', '/api/aircraft-types');
      check(own.status === 200 && JSON.stringify(own.body).includes(designator), `the admin who made the type does not see it (${own.status})`);
      // Another person's plain list is a read from the (lagging) replica, without the new type.
      const list = await reader.send('GET', '/api/aircraft-types');
      check(list.status === 200, `the list answered ${list.status}`);
      check(!JSON.stringify(list.body).includes(designator), 'the list came from the primary, not the replica');
      // The sync reads the primary: the device gets the new type now, and its cursor is right.
      const sync = await pilot.send('GET', `/api/sync?cursor=${encodeURIComponent((before.body as { cursor: string }).cursor)}`);
      check((sync.body as { aircraftTypes: { id: number }[] }).aircraftTypes.some((type) => type.id === id), 'the sync did not answer the type written on the primary');
      await setReplicating(pair, true);
      await waitReplicaCaughtUp(pair);
      const later = await reader.send('GET', '/api/aircraft-types');
      check(JSON.stringify(later.body).includes(designator), 'the replica never showed the new type');
    } finally {
      await setReplicating(pair, true);
    }
  } finally {
    await stopApp(app);
    await primary.close();
    if (process.env['KEEP_CLUSTER'] !== '1') await stopReplicaPair();
  }
}

async function main(): Promise<number> {
  const started = Date.now();
  const layout = clusterLayout();
  const wasRunning = layout.nodes.every((node) => nodePid(node)) && layout.apps.every((app) => appPid(app));
  const cluster = await startCluster((line) => console.log(`\u203a ${line}`));
  const nodes = cluster.nodeUrls.map((url) => createSequelize(url));
  initModels(nodes[0]!);
  console.log('\u203a Seeding the invented demo operator (invented demo data — not for flight)');
  await seedDemo(nodes[0]!, DEFAULT_DEMO_PASSWORD, { signingKeySecret: localSecrets().signingKeySecret });

  const pilotUser = await User.findOne({ where: { email: email('pilot') }, rejectOnEmpty: true });
  const actor = { operatorId: pilotUser.operatorId, userId: pilotUser.id, role: pilotUser.role };
  const type = await AircraftType.findOne({ where: { operatorId: actor.operatorId, designator: 'ZZP1' }, rejectOnEmpty: true });
  const book = await SpeedBook.findOne({ where: { aircraftTypeId: type.id }, rejectOnEmpty: true });
  const airframe = await Airframe.findOne({ where: { aircraftTypeId: type.id, active: true }, rejectOnEmpty: true });
  const world: World = {
    lb: cluster.url,
    instanceUrls: cluster.layout.apps.map((app) => `http://127.0.0.1:${app.port}`),
    nodes,
    bookId: book.id,
    async entries(count) {
      const revision = await Revision.findOne({ where: { speedBookId: book.id, status: 'published' }, rejectOnEmpty: true });
      const source = await loadCardSource(actor, revision.id, airframe.id, 'issue');
      // Invented demo data — not for flight.
      const inputs: CardInputs = { airframeId: airframe.id, weightKg: 950, configuration: 'takeoff-flap', departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 }, isaDeviationC: 3, cruise: { iasKt: 110 }, altitudeStepFt: 2000 };
      const card = buildCard(source.revision, inputs, source.context);
      return Array.from({ length: count }, () => ({ id: randomUUID(), airframeId: airframe.id, revisionId: revision.id, inputs: card.inputs as CardInputs, digest: card.digest, issuedAt: new Date().toISOString() }));
    },
  };

  let passed = 0;
  let failed = 0;
  for (const [name, run] of scenarios) {
    const t0 = Date.now();
    try {
      await run(world);
      passed++;
      console.log(`  \u2713 ${name} (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
    } catch (error) {
      failed++;
      console.log(`  \u2717 ${name} (${((Date.now() - t0) / 1000).toFixed(1)} s)\n      ${error instanceof Error ? error.message : String(error)}`);
    }
  }
  await Promise.all(nodes.map((node) => node.close()));
  const t0 = Date.now();
  const replicaName = 'read replica: plain reads from the replica; sessions, the sync cursor and a writer\'s own reads from the primary';
  try {
    await replicaScenario();
    passed++;
    console.log(`  \u2713 ${replicaName} (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  } catch (error) {
    failed++;
    console.log(`  \u2717 ${replicaName}\n      ${error instanceof Error ? error.message : String(error)}`);
  }
  if (!wasRunning && process.env['KEEP_CLUSTER'] !== '1') await stopCluster((line) => console.log(`\u203a ${line}`));
  console.log(`\n${passed} passed, ${failed} failed (${((Date.now() - started) / 1000).toFixed(0)} s)`);
  return failed === 0 ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.stack : error);
    process.exit(1);
  },
);
