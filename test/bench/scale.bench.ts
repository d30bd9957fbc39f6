/**
 * The cost of growth (issue 15 part 5). Run: `npm run bench:scale`; quick mode
 * `SCALE_SIZES=small,medium npm run bench:scale`. Not part of `npm test` nor of `npm run bench`.
 *
 * One generated operator at three sizes, each in a database of its own on the private test
 * instance (`speedwright_bench_scale_<size>`, recreated each run, dropped after it):
 *
 * | size   | airframes | people | card-log entries | audit events (a year) |
 * |--------|-----------|--------|------------------|-----------------------|
 * | small  | 50        | 200    | 10,000           | 20,000                |
 * | medium | 500       | 2,000  | 100,000          | 200,000               |
 * | large  | 5,000     | 20,000 | 1,000,000        | 2,000,000             |
 *
 * The types, their speed books and revisions (really signed), the bench's own people and a few
 * cards are written through the same services as the API; the bulk (the other airframes,
 * people, card-log entries and audit events) by multi-row `INSERT … SELECT` from MariaDB's
 * sequence tables in batches of BATCH rows, so neither Node nor the server holds a size in
 * memory. All of it is invented demo data — not for flight: `ZZ-` registrations, `.example`
 * addresses, a fictional operator.
 *
 * Measured through the real Express app (`createApp`, loopback HTTP, gzip) as a client would,
 * median of several runs, ms: a pilot's full sync and no-change sync; the card-log list (a page
 * filtered by airframe, its next page, a page filtered by a week's date range); the audit trail
 * (a page filtered by actor, a page filtered by a date range); `GET /api/verify/:code` for an
 * existing code; publishing a revision (`POST /api/revisions/:id/approve`); and the database
 * size (information_schema data + index length). Each figure is printed at each size with the
 * growth ratio between sizes. Targets: every read a pilot or the public makes (no-change sync,
 * verify) and the log and audit pages grow well under the size (ratio < 3× per 10×); EXPLAIN
 * of the card-log, verify and audit queries names an index on card_issues / audit_events
 * (never a whole-table scan: `type ALL`, or `index`, which reads a whole index in order). The
 * full sync carries every airframe, so its payload grows with the fleet by design: its ratio is
 * printed beside the payload's, without a target.
 */
import type { AddressInfo } from 'node:net';
import { loadavg } from 'node:os';
import { randomUUID } from 'node:crypto';
import { pino } from 'pino';
import { call, cookiesOf, median, type Answer } from './timed-http';
import { QueryTypes, type Sequelize } from 'sequelize';
import { openLocalDatabase, type LocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { createSequelize } from '../../db/connection';
import { seedOperators, type SeedOperator, type SeedType } from '../../server/dev/demo-seed';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { AircraftType, Airframe, initModels, Revision, SpeedBook, User } from '../../server/models';
import { recordCardIssue } from '../../server/cards/card-issues.service';
import { loadCardSource } from '../../server/cards/card-source';
import { createRevision, submitRevision } from '../../server/revisions/revisions.service';
import { VERIFY_SQL } from '../../server/verify/verify.service';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { demoLightTwinJetContent, demoPistonTrainerContent, demoTwinTurbopropContent } from '@shared/speed-book/demo-content';
import type { RevisionContent } from '@shared/speed-book/revision-content';

interface Size {
  name: 'small' | 'medium' | 'large';
  airframes: number;
  people: number;
  cards: number;
  auditEvents: number;
}
const SIZES: Size[] = [
  { name: 'small', airframes: 50, people: 200, cards: 10_000, auditEvents: 20_000 },
  { name: 'medium', airframes: 500, people: 2_000, cards: 100_000, auditEvents: 200_000 },
  { name: 'large', airframes: 5_000, people: 20_000, cards: 1_000_000, auditEvents: 2_000_000 },
];
/** Rows per INSERT … SELECT: bounded memory on both sides whatever the size. */
const BATCH = 20_000;
/** Read targets: growth ratio per 10× size. */
const READ_RATIO_TARGET = 3;
const TYPES = 6;
const PASSWORD = 'bench-password-not-for-use';
const SIGNING_KEY_SECRET = 'bench-signing-key-secret-0123456789-abcdefghij';
const YEAR_MS = 365 * 24 * 3600 * 1000;
/** The generated year ends here (a fixed instant, so the date filters find the same share at each size). */
const YEAR_END = Date.parse('2026-12-01T00:00:00Z');

const KINDS: { category: SeedType['category']; engines: number; ceilingFt: number; content: () => RevisionContent }[] = [
  { category: 'piston-single', engines: 1, ceilingFt: 14000, content: demoPistonTrainerContent },
  { category: 'turboprop', engines: 2, ceilingFt: 30000, content: demoTwinTurbopropContent },
  { category: 'jet', engines: 2, ceilingFt: 41000, content: demoLightTwinJetContent },
];

const PEOPLE = {
  pilot: 'pilot@wrenmoor-scale.example',
  engineer: 'engineer@wrenmoor-scale.example',
  approver: 'approver@wrenmoor-scale.example',
};

/** Invented demo data — not for flight: the operator's types, first airframes and books. */
function generatedOperator(): SeedOperator {
  const fleet: SeedType[] = Array.from({ length: TYPES }, (_, t) => {
    const kind = KINDS[t % KINDS.length]!;
    const designator = `ZZS${t + 1}`;
    return {
      designator,
      name: `Scale type ${t + 1} (generated)`,
      category: kind.category,
      engines: kind.engines,
      ceilingFt: kind.ceilingFt,
      airframes: [{ registration: `ZZ-S${String.fromCharCode(65 + t)}AA`, serial: `${designator}-0001` }],
      speedBook: {
        title: `${designator} speed book`,
        revisions: [1, 2].map((r) => ({ content: kind.content(), changeSummary: `Generated revision ${r} (invented demo data — not for flight).` })),
      },
    };
  });
  return {
    slug: 'wrenmoor-scale',
    name: 'Wrenmoor Air Freight (generated scale operator — invented demo data, not for flight)',
    people: [
      { email: PEOPLE.pilot, displayName: 'Scale Pilot', role: 'pilot' },
      { email: PEOPLE.engineer, displayName: 'Scale Engineer', role: 'engineer' },
      { email: PEOPLE.approver, displayName: 'Scale Approver', role: 'approver' },
    ],
    fleet,
  };
}

// ---------------------------------------------------------------------------------------------
// Generating the bulk

const select = <T extends object>(sequelize: Sequelize, sql: string, replacements: unknown[] = []) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const run = (sequelize: Sequelize, sql: string, replacements: unknown[] = []) => sequelize.query(sql, { replacements, raw: true });

/** `insert` once per batch of sequence numbers from..to (inclusive), each batch one statement. */
async function inBatches(total: number, insert: (from: number, to: number) => Promise<unknown>): Promise<void> {
  for (let from = 1; from <= total; from += BATCH) await insert(from, Math.min(total, from + BATCH - 1));
}

/** Four letters from a number (26^4 = 456,976 registrations). */
const LETTERS4 = (n: string) =>
  `CONCAT(CHAR(65 + ${n} DIV 17576 % 26), CHAR(65 + ${n} DIV 676 % 26), CHAR(65 + ${n} DIV 26 % 26), CHAR(65 + ${n} % 26))`;

interface Seeded {
  operatorId: number;
  pilotId: number;
  approverId: number;
  code: string;
  cardInputs: string;
  cardDigest: string;
}

async function generate(sequelize: Sequelize, size: Size): Promise<Seeded> {
  await seedOperators(sequelize, [generatedOperator()], PASSWORD, { signingKeySecret: SIGNING_KEY_SECRET });
  const pilot = await User.findOne({ where: { email: PEOPLE.pilot }, rejectOnEmpty: true });
  const approver = await User.findOne({ where: { email: PEOPLE.approver }, rejectOnEmpty: true });
  const operatorId = pilot.operatorId;
  const seq = (n: number) => `seq_1_to_${n}`;

  // Airframes, spread over the types (the trigger gives each its sync number).
  const types = await AircraftType.findAll({ where: { operatorId }, order: [['id', 'ASC']] });
  const extraFrames = size.airframes - types.length;
  const typeIds = types.map((type) => type.id).join(', ');
  await inBatches(extraFrames, (from, to) =>
    run(
      sequelize,
      `INSERT INTO airframes (operator_id, aircraft_type_id, registration, serial, active, created_at, updated_at)
       SELECT ?, ELT(1 + seq % ${types.length}, ${typeIds}), CONCAT('ZZ-', ${LETTERS4('seq')}), CONCAT('SN-', LPAD(seq, 6, '0')), 1, NOW(3), NOW(3)
       FROM ${seq(extraFrames)} WHERE seq BETWEEN ? AND ?`,
      [operatorId, from, to],
    ),
  );

  // People: 85 % pilots, 10 % engineers, 4 % approvers, 1 % administrators; the pilot's hash, so any could sign in.
  const extraPeople = size.people - 3;
  await inBatches(extraPeople, (from, to) =>
    run(
      sequelize,
      `INSERT INTO users (operator_id, email, display_name, role, password_hash, failed_sign_ins, locked_by_admin, created_at, updated_at)
       SELECT ?, CONCAT('person-', LPAD(seq, 6, '0'), '@wrenmoor-scale.example'), CONCAT('Generated person ', seq),
              CASE WHEN seq % 100 < 85 THEN 'pilot' WHEN seq % 100 < 95 THEN 'engineer' WHEN seq % 100 < 99 THEN 'approver' ELSE 'admin' END,
              ?, 0, 0, NOW(3), NOW(3)
       FROM ${seq(extraPeople)} WHERE seq BETWEEN ? AND ?`,
      [operatorId, pilot.passwordHash, from, to],
    ),
  );

  // A few real cards through the card log's own service (re-derived, coded, audited).
  const book = await SpeedBook.findOne({ where: { operatorId, aircraftTypeId: types[0]!.id }, rejectOnEmpty: true });
  const revision = await Revision.findOne({ where: { speedBookId: book.id, status: 'published' }, rejectOnEmpty: true });
  const airframe = await Airframe.findOne({ where: { operatorId, aircraftTypeId: types[0]!.id }, order: [['id', 'ASC']], rejectOnEmpty: true });
  const actor = { operatorId, userId: pilot.id, role: pilot.role };
  const source = await loadCardSource(actor, revision.id, airframe.id, 'issue');
  // Invented demo data — not for flight.
  const inputs: CardInputs = {
    airframeId: airframe.id,
    weightKg: 950,
    configuration: 'takeoff-flap',
    departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
    isaDeviationC: 3,
    cruise: { iasKt: 110 },
    altitudeStepFt: 2000,
  };
  const digest = buildCard(source.revision, inputs, source.context).digest;
  const issued = await recordCardIssue(actor, { id: randomUUID(), airframeId: airframe.id, revisionId: revision.id, inputs, digest, issuedAt: new Date(YEAR_END - 3600_000).toISOString() });
  if (issued.outcome !== 'recorded') throw new Error(`The bench card was not recorded: ${issued.error.message}`);
  const [stored] = await select<{ inputs: string }>(sequelize, 'SELECT inputs FROM card_issues WHERE code = ?', [issued.code]);

  // Lookup tables for the bulk: airframe n → id and its type's published revision; pilot n → id.
  await run(sequelize, 'CREATE TABLE bench_frames (n INT UNSIGNED PRIMARY KEY, id INT UNSIGNED NOT NULL, revision_id INT UNSIGNED NOT NULL) ENGINE=InnoDB');
  await run(
    sequelize,
    `INSERT INTO bench_frames SELECT ROW_NUMBER() OVER (ORDER BY a.id) - 1, a.id, r.id
     FROM airframes a JOIN speed_books b ON b.aircraft_type_id = a.aircraft_type_id JOIN revisions r ON r.speed_book_id = b.id AND r.status = 'published'
     WHERE a.operator_id = ?`,
    [operatorId],
  );
  await run(sequelize, 'CREATE TABLE bench_people (n INT UNSIGNED PRIMARY KEY, id INT UNSIGNED NOT NULL) ENGINE=InnoDB');
  await run(sequelize, `INSERT INTO bench_people SELECT ROW_NUMBER() OVER (ORDER BY id) - 1, id FROM users WHERE operator_id = ? AND role = 'pilot'`, [operatorId]);
  const [{ frames }] = await select<{ frames: number }>(sequelize, 'SELECT COUNT(*) AS frames FROM bench_frames');
  const [{ pilots }] = await select<{ pilots: number }>(sequelize, 'SELECT COUNT(*) AS pilots FROM bench_people');

  // The card log: a year of entries, evenly spread, random-looking ids (as devices' UUIDs are).
  // Codes are sequential and start with X, outside the code alphabet, so none is a real code's twin.
  const stepMs = YEAR_MS / size.cards;
  await inBatches(size.cards, (from, to) =>
    run(
      sequelize,
      `INSERT INTO card_issues (id, operator_id, issued_by_id, airframe_id, revision_id, inputs, digest, entry_sha256, issued_at, received_at, code)
       SELECT CONCAT_WS('-', SUBSTR(h, 1, 8), SUBSTR(h, 9, 4), CONCAT('4', SUBSTR(h, 14, 3)), CONCAT('a', SUBSTR(h, 18, 3)), SUBSTR(h, 21, 12)),
              ?, p.id, f.id, f.revision_id, ?, ?, SHA2(CONCAT('entry', s.seq), 256),
              FROM_UNIXTIME((? + s.seq * ?) / 1000), FROM_UNIXTIME((? + s.seq * ? + 60000) / 1000),
              CONCAT('X', LPAD(CONV(s.seq, 10, 36), 8, '0'))
       FROM (SELECT seq, MD5(CONCAT('scale-card-', seq)) AS h FROM ${seq(size.cards)} WHERE seq BETWEEN ? AND ?) s
       JOIN bench_frames f ON f.n = s.seq % ${frames}
       JOIN bench_people p ON p.n = (s.seq * 7919) % ${pilots}`,
      [operatorId, stored!.inputs, digest, YEAR_END - YEAR_MS, stepMs, YEAR_END - YEAR_MS, stepMs, from, to],
    ),
  );

  // A year of audit events: mostly cards issued, then sign-ins, revisions and fleet changes.
  const auditStepMs = YEAR_MS / size.auditEvents;
  await inBatches(size.auditEvents, (from, to) =>
    run(
      sequelize,
      `INSERT INTO audit_events (operator_id, actor_id, action, entity_type, entity_id, details, ip, user_agent, created_at)
       SELECT ?, p.id,
              ELT(1 + s.seq % 10, 'card.issued', 'card.issued', 'card.issued', 'card.issued', 'card.issued', 'card.issued', 'auth.sign-in', 'auth.sign-in', 'revision.submitted', 'airframe.updated'),
              ELT(1 + s.seq % 10, 'card-issue', 'card-issue', 'card-issue', 'card-issue', 'card-issue', 'card-issue', 'user', 'user', 'revision', 'airframe'),
              CASE WHEN s.seq % 10 < 6 THEN MD5(CONCAT('scale-card-', s.seq)) WHEN s.seq % 10 < 8 THEN p.id ELSE f.id END,
              '{"generated":"invented demo data — not for flight"}', CONCAT('192.0.2.', s.seq % 250), 'Generated bench client',
              FROM_UNIXTIME((? + s.seq * ?) / 1000)
       FROM ${seq(size.auditEvents)} s
       JOIN bench_frames f ON f.n = s.seq % ${frames}
       JOIN bench_people p ON p.n = (s.seq * 104729) % ${pilots}
       WHERE s.seq BETWEEN ? AND ?`,
      [operatorId, YEAR_END - YEAR_MS, auditStepMs, from, to],
    ),
  );
  await run(sequelize, 'DROP TABLE bench_frames');
  await run(sequelize, 'DROP TABLE bench_people');
  await select(sequelize, 'ANALYZE TABLE airframes, users, card_issues, audit_events');
  return { operatorId, pilotId: pilot.id, approverId: approver.id, code: issued.code, cardInputs: stored!.inputs, cardDigest: digest };
}

// ---------------------------------------------------------------------------------------------
// Measuring through the app

/** A signed-in client: its cookies and CSRF token. */
class Client {
  private readonly jar = new Map<string, string>();
  private token = '';
  constructor(private readonly port: number) {}

  private keep(answer: Answer): void {
    cookiesOf(answer, this.jar);
  }

  private headers(): Record<string, string> {
    return { cookie: [...this.jar].map(([k, v]) => `${k}=${v}`).join('; '), 'content-type': 'application/json', 'x-csrf-token': this.token };
  }

  async signIn(email: string): Promise<void> {
    const csrf = await call(this.port, 'GET', '/api/auth/csrf', {});
    this.keep(csrf);
    this.token = (JSON.parse(csrf.body) as { token: string }).token;
    const login = await call(this.port, 'POST', '/api/auth/login', this.headers(), JSON.stringify({ email, password: PASSWORD }));
    if (login.status !== 200) throw new Error(`${email} could not sign in: ${login.status} ${login.body}`);
    this.keep(login);
    // The session was renewed at sign-in; its token with it.
    const renewed = await call(this.port, 'GET', '/api/auth/csrf', this.headers());
    this.keep(renewed);
    this.token = (JSON.parse(renewed.body) as { token: string }).token;
  }

  async get(path: string): Promise<Answer> {
    const answer = await call(this.port, 'GET', path, this.headers());
    if (answer.status !== 200) throw new Error(`GET ${path} answered ${answer.status}: ${answer.body.slice(0, 300)}`);
    return answer;
  }

  async post(path: string, body: unknown = {}): Promise<Answer> {
    const answer = await call(this.port, 'POST', path, this.headers(), JSON.stringify(body));
    if (answer.status !== 200) throw new Error(`POST ${path} answered ${answer.status}: ${answer.body.slice(0, 300)}`);
    return answer;
  }
}

/** Median ms of `runs` calls after one warm-up. */
async function timed(runs: number, once: () => Promise<Answer>): Promise<{ ms: number; last: Answer }> {
  let last = await once();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    last = await once();
    times.push(last.ms);
  }
  return { ms: median(times), last };
}

interface Plan {
  table: string;
  type: string;
  key: string | null;
  rows: number;
}

/** EXPLAIN of `sql`: the access to `table` (its alias's row). */
async function explain(sequelize: Sequelize, sql: string, table: string, replacements: unknown[] = []): Promise<Plan> {
  const rows = await select<{ table: string; type: string; key: string | null; rows: number }>(sequelize, `EXPLAIN ${sql}`, replacements);
  const row = rows.find((r) => r.table === table);
  if (!row) throw new Error(`EXPLAIN names no ${table}: ${JSON.stringify(rows)}`);
  return { table, type: row.type, key: row.key, rows: Number(row.rows) };
}

type Figures = Record<string, number>;
type Plans = Record<string, Plan>;

async function measure(size: Size, local: LocalDatabase, database: string): Promise<{ figures: Figures; plans: Plans; seedSeconds: number }> {
  // Captures the SQL of one request at a time, to EXPLAIN what the app really asked.
  let capture: string[] | null = null;
  const sequelize = createSequelize(local.url, [], (sql: string) => {
    capture?.push(sql.replace(/^Executing \([^)]*\): /, ''));
  });
  initModels(sequelize);
  await createMigrator(sequelize).up();
  const started = process.hrtime.bigint();
  const seeded = await generate(sequelize, size);
  const seedSeconds = Number(process.hrtime.bigint() - started) / 1e9;

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
  const figures: Figures = {};
  const plans: Plans = {};
  try {
    const pilot = new Client(port);
    await pilot.signIn(PEOPLE.pilot);
    const approver = new Client(port);
    await approver.signIn(PEOPLE.approver);

    // A pilot's sync.
    const full = await timed(5, () => pilot.get('/api/sync'));
    const answer = JSON.parse(full.last.body) as { cursor: string; airframes: unknown[] };
    if (answer.airframes.length !== size.airframes) throw new Error(`The full sync gave ${answer.airframes.length} airframes, not ${size.airframes}`);
    figures['full sync'] = full.ms;
    figures['full sync gzip kB'] = full.last.wireBytes / 1000;
    const cursor = encodeURIComponent(answer.cursor);
    figures['no-change sync'] = (await timed(30, () => pilot.get(`/api/sync?cursor=${cursor}`))).ms;

    // The card log, as the approver reads it.
    const [frame] = await select<{ id: number }>(sequelize, 'SELECT id FROM airframes WHERE operator_id = ? ORDER BY id LIMIT 1 OFFSET 1', [seeded.operatorId]);
    const byFrame = `/api/card-issues?airframeId=${frame!.id}&limit=50`;
    const first = await timed(15, () => approver.get(byFrame));
    figures['card log, by airframe'] = first.ms;
    const next = (JSON.parse(first.last.body) as { nextCursor: string | null }).nextCursor;
    if (!next) throw new Error('The airframe filter gave a single page');
    figures['card log, next page'] = (await timed(15, () => approver.get(`${byFrame}&cursor=${encodeURIComponent(next)}`))).ms;
    const week = `from=${new Date(YEAR_END - 180 * 86400_000).toISOString()}&to=${new Date(YEAR_END - 173 * 86400_000).toISOString()}`;
    figures['card log, by week'] = (await timed(15, () => approver.get(`/api/card-issues?${week}&limit=50`))).ms;

    // The audit trail.
    const byActor = `/api/audit?actorId=${seeded.pilotId}&limit=50`;
    figures['audit, by actor'] = (await timed(15, () => approver.get(byActor))).ms;
    figures['audit, by week'] = (await timed(15, () => approver.get(`/api/audit?${week}&limit=50`))).ms;

    // The public card check, no session.
    figures['verify a code'] = (await timed(30, () => call(port, 'GET', `/api/verify/${seeded.code}`, {}))).ms;

    // Publishing: drafts written and submitted by the engineer beforehand, approved over HTTP.
    const engineer = await User.findOne({ where: { email: PEOPLE.engineer }, rejectOnEmpty: true });
    const engineerActor = { operatorId: seeded.operatorId, userId: engineer.id, role: engineer.role, sendsMail: false };
    // One open revision per book at a time: one draft in each of the TYPES books, a copy of its published content.
    const books = await SpeedBook.findAll({ where: { operatorId: seeded.operatorId }, order: [['id', 'ASC']] });
    const ready: number[] = [];
    for (const [i, book] of books.entries()) {
      const draft = await createRevision(engineerActor, book.id, { changeSummary: `Scale bench revision ${i + 1} (invented demo data — not for flight).` });
      await submitRevision(engineerActor, draft.id);
      ready.push(draft.id);
    }
    figures['publish a revision'] = (await timed(5, () => approver.post(`/api/revisions/${ready.shift()!}/approve`))).ms;

    // The plans of the queries the app sent.
    const captured = async (path: string, client: Client): Promise<string> => {
      capture = [];
      await client.get(path);
      const sql = capture.find((text) => /^SELECT/i.test(text) && /FROM `(card_issues|audit_events)`/.test(text));
      capture = null;
      if (!sql) throw new Error(`No card_issues / audit_events query captured for ${path}`);
      return sql.replace(/;\s*$/, '');
    };
    plans['card log, by airframe'] = await explain(sequelize, await captured(byFrame, approver), 'CardIssue');
    plans['card log, by week'] = await explain(sequelize, await captured(`/api/card-issues?${week}&limit=50`, approver), 'CardIssue');
    plans['audit, by actor'] = await explain(sequelize, await captured(byActor, approver), 'AuditEvent');
    plans['audit, by week'] = await explain(sequelize, await captured(`/api/audit?${week}&limit=50`, approver), 'AuditEvent');
    plans['verify a code'] = await explain(sequelize, VERIFY_SQL, 'ci', [seeded.code]);

    const [bytes] = await select<{ total: number; cards: number; audit: number }>(
      sequelize,
      `SELECT SUM(data_length + index_length) AS total,
              SUM(CASE WHEN table_name = 'card_issues' THEN data_length + index_length ELSE 0 END) AS cards,
              SUM(CASE WHEN table_name = 'audit_events' THEN data_length + index_length ELSE 0 END) AS audit
       FROM information_schema.tables WHERE table_schema = DATABASE()`,
    );
    figures['database MB'] = Number(bytes!.total) / 1e6;
    figures['card log MB'] = Number(bytes!.cards) / 1e6;
    figures['audit MB'] = Number(bytes!.audit) / 1e6;
  } finally {
    server.close();
    await close();
    await sequelize.query(`DROP DATABASE \`${database}\``);
    await sequelize.close();
  }
  return { figures, plans, seedSeconds };
}

/** The figures whose growth is held to READ_RATIO_TARGET. */
const HELD = ['no-change sync', 'card log, by airframe', 'card log, next page', 'card log, by week', 'audit, by actor', 'audit, by week', 'verify a code'];

async function main(): Promise<number> {
  const wanted = (process.env['SCALE_SIZES'] ?? 'small,medium,large').split(',').map((name) => name.trim());
  const sizes = SIZES.filter((size) => wanted.includes(size.name));
  if (!sizes.length) throw new Error(`SCALE_SIZES names none of ${SIZES.map((size) => size.name).join(', ')}`);
  const results: { size: Size; figures: Figures; plans: Plans }[] = [];
  const began = process.hrtime.bigint();
  let missed = false;
  for (const size of sizes) {
    const database = `speedwright_bench_scale_${size.name}`;
    const local = await openLocalDatabase('test', database, { fresh: true });
    const sizeBegan = process.hrtime.bigint();
    const { figures, plans, seedSeconds } = await measure(size, local, database);
    const total = Number(process.hrtime.bigint() - sizeBegan) / 1e9;
    console.log(`${size.name}: ${size.airframes} airframes, ${size.people} people, ${size.cards} card-log entries, ${size.auditEvents} audit events — generated in ${seedSeconds.toFixed(0)} s, size done in ${total.toFixed(0)} s (load average ${loadavg().map((v) => v.toFixed(2)).join(' ')})`);
    for (const [what, plan] of Object.entries(plans)) {
      // `ALL` reads the table, `index` the whole of an index in order: both grow with the table.
      const scan = plan.type === 'ALL' || plan.type === 'index' || !plan.key;
      if (scan) missed = true;
      console.log(`  EXPLAIN ${what}: ${plan.table} type ${plan.type}, key ${plan.key ?? '(none)'}, ~${plan.rows} rows${scan ? '  ← WHOLE-TABLE SCAN' : ''}`);
    }
    results.push({ size, figures, plans });
  }

  const names = Object.keys(results[0]!.figures);
  const header = ['figure', ...results.map((r) => r.size.name), ...results.slice(1).map((r, i) => `${results[i]!.size.name}→${r.size.name}`)];
  const lines = [header];
  for (const name of names) {
    const values = results.map((r) => r.figures[name]!);
    const ratios = values.slice(1).map((value, i) => value / values[i]!);
    const held = HELD.includes(name);
    const over = held && ratios.some((ratio) => ratio >= READ_RATIO_TARGET);
    if (over) missed = true;
    lines.push([`${name}${name.includes('MB') || name.includes('kB') ? '' : ' (ms)'}${held ? ` [< ${READ_RATIO_TARGET}×]` : ''}`, ...values.map((v) => (v >= 100 ? v.toFixed(0) : v.toFixed(1))), ...ratios.map((r) => `${r.toFixed(2)}×${over && r >= READ_RATIO_TARGET ? ' ←' : ''}`)]);
  }
  const widths = header.map((_, c) => Math.max(...lines.map((line) => line[c]!.length)));
  console.log('');
  for (const line of lines) console.log(line.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join('  '));
  console.log(`\nWhole run ${(Number(process.hrtime.bigint() - began) / 1e9 / 60).toFixed(1)} min. ${missed ? 'Target MISSED.' : 'Targets met.'}`);
  return missed ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error);
    process.exit(1);
  },
);
