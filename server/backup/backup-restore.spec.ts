/**
 * The backup/restore round trip on the private test MariaDB instance (issue 14, part 4): a
 * database seeded as people would fill it (the demo seed, then through the API a revision with
 * source pages, published and signed, and cards issued), backed up, then dropped with its
 * attachments, and restored into a fresh empty database. After the restore every revision's
 * content hash (SHA-256 of the RFC 8785 canonical JSON) and Ed25519 signature (RFC 8032) verify
 * with the operator's public key, every attachment's SHA-256 matches its record, every card code
 * checks through `GET /api/verify/:code`, and a device's sync continues where it was. Damaged,
 * partial and misdirected restores are refused and leave their target as it was.
 */
import { spawnSync } from 'node:child_process';
import { createHash, randomUUID, webcrypto } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, readFileSync, readdirSync, rmSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import { mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { createSequelize } from '../../db/connection';
import { recreateDatabase } from '../../db/instance';
import { openLocalDatabase, type LocalDatabase } from '../../db/local';
import { createMigrator, migrationNames } from '../../db/migrator';
import { syncResponseSchema, type SyncResponse } from '@shared/api/sync';
import { cardIssueBatchResponseSchema, cardPreviewResponseSchema } from '@shared/card/card-api';
import type { CardInputs } from '@shared/card/card';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { API_TEST_DATABASE, TEST_PASSWORD, TEST_SIGNING_KEY_SECRET } from '../../test/api/constants';
import { demoEmail, signIn, startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, publish, type Session } from '../../test/api/test-helpers';
import { seedDemo } from '../dev/demo-seed';
import { DomainError } from '../errors/domain-error';
import { AircraftType, Airframe, Attachment, CardIssue, initModels, Revision, SigningKey, SpeedBook } from '../models';
import { verifyStatement } from '../revisions/signing';
import { createBackup, type BackupResult } from './backup.service';
import { appliedMigrations, databaseObjects, nextSyncNumbers, openDatabase, RESTORE_SEQUENCE_GAP } from './database-contents';
import { restoreBackup, type RestoreResult } from './restore.service';

// Seeding signs revisions and sweeps envelopes, sign-ins hash passwords: minutes on a busy machine.
jest.setTimeout(180_000);

const SOURCE = `${API_TEST_DATABASE}_bk_source`;
const TARGET = `${API_TEST_DATABASE}_bk_target`;
const SPARE = `${API_TEST_DATABASE}_bk_spare`;

/** A small well-formed PDF and PNG (the upload checks their signatures). */
const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n' +
    '3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 200 200]>>endobj\nxref\n0 4\n0000000000 65535 f \n' +
    'trailer<</Size 4/Root 1 0 R>>\nstartxref\n0\n%%EOF\n',
  'latin1',
);
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
  Buffer.from('IHDR', 'latin1'),
  Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0, 0x1f, 0x15, 0xc4, 0x89]),
  Buffer.alloc(200_000, 0x5a),
]);

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

interface SignedRevisionRow {
  id: number;
  operatorId: number;
  speedBookId: number;
  number: number;
  status: string;
  content: string;
  contentSha256: string | null;
  signature: string | null;
  signingKeyId: number | null;
  publishedAt: Date | null;
}

/** What the source database held, read before it was dropped. */
interface SourceFacts {
  revisions: SignedRevisionRow[];
  publicKeys: Map<number, string>;
  attachments: { id: number; sha256: string; sizeBytes: number }[];
  cards: { code: string; registration: string }[];
  /** A device's cursor from before the last change, and what a sync from it answered. */
  deviceCursor: string;
  changesSinceCursor: SyncResponse;
  syncNumbersNext: Record<string, number>;
  /** A cursor from after the backup (the device saw a change the backup does not hold). */
  cursorAheadOfBackup: string;
}

let work: string;
let source: LocalDatabase;
let target: LocalDatabase;
let backupDir: string;
let backup: BackupResult;
let restored: RestoreResult;
let facts: SourceFacts;
let harness: Harness;
const sourceAttachments = () => join(work, 'source-attachments');
const targetAttachments = () => join(work, 'target-attachments');

const post = (who: Session, path: string) => who.agent.post(path).set('x-csrf-token', who.token);

async function sync(who: Session, cursor?: string): Promise<SyncResponse> {
  const res = await who.agent.get('/api/sync').query(cursor === undefined ? {} : { cursor }).expect(200);
  return syncResponseSchema.parse(res.body);
}

const cardInputs = (airframeId: number, weightKg: number): CardInputs => ({
  airframeId,
  weightKg,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
  isaDeviationC: 3,
  cruise: { iasKt: 110 },
  altitudeStepFt: 2000,
});

/** The pilot previews a card and reports it issued (as the device does); its code. */
async function issueCard(pilot: Session, revisionId: number, inputs: CardInputs): Promise<string> {
  const card = cardPreviewResponseSchema.parse((await post(pilot, '/api/cards/preview').send({ revisionId, inputs }).expect(200)).body).card;
  const entry = { id: randomUUID(), airframeId: inputs.airframeId, revisionId, inputs, digest: card.digest, issuedAt: new Date().toISOString() };
  const [result] = cardIssueBatchResponseSchema.parse((await post(pilot, '/api/card-issues').send({ entries: [entry] }).expect(200)).body).results;
  if (result!.outcome !== 'recorded') throw new Error(result!.error.message);
  return result!.code;
}

async function addAirframe(admin: Session, aircraftTypeId: number): Promise<number> {
  const registration = `ZZ-${randomUUID().slice(0, 3).toUpperCase()}`;
  const created = await post(admin, '/api/airframes').send({ registration, serial: `BK-${registration}`, aircraftTypeId }).expect(201);
  return created.body.airframe.id as number;
}

/** Fills the source database as people would: the demo seed, then a revision with source pages, cards, a device's sync. */
async function fillSource(): Promise<Omit<SourceFacts, 'syncNumbersNext' | 'cursorAheadOfBackup'>> {
  const seeding = createSequelize(source.url);
  initModels(seeding);
  await createMigrator(seeding).up();
  await seedDemo(seeding, TEST_PASSWORD, { signingKeySecret: TEST_SIGNING_KEY_SECRET });
  await seeding.close();

  const sourceHarness = startHarness({ DATABASE_URL: source.url, ATTACHMENTS_DIR: sourceAttachments() });
  try {
    const [admin, engineer, approver, pilot] = await Promise.all(['admin', 'engineer', 'approver', 'pilot'].map((role) => signIn(sourceHarness.app, demoEmail(role as 'pilot'))));
    const book = await newSpeedBook(admin!, engineer!);
    const draft = await post(engineer!, `/api/speed-books/${book.speedBookId}/revisions`)
      .send({ content: demoPistonTrainerContent(), changeSummary: 'Backup test (invented demo data — not for flight)' })
      .expect(201);
    const revisionId = draft.body.revision.id as number;
    await post(engineer!, `/api/revisions/${revisionId}/attachments`).attach('file', PDF, { filename: 'AFM 5-3 stall speeds.pdf', contentType: 'application/pdf' }).expect(201);
    await post(engineer!, `/api/revisions/${revisionId}/attachments`).attach('file', PNG, { filename: 'AFM 2-4 airspeed limits.png', contentType: 'image/png' }).expect(201);
    await post(engineer!, `/api/revisions/${revisionId}/submit`).expect(200);
    await post(approver!, `/api/revisions/${revisionId}/approve`).expect(200);
    const airframeId = await addAirframe(admin!, book.aircraftTypeId);

    // Cards on the new revision and on the demo trainer's current one.
    const trainer = await AircraftType.findOne({ where: { designator: 'ZZP1' }, rejectOnEmpty: true });
    const trainerBook = await SpeedBook.findOne({ where: { aircraftTypeId: trainer.id }, rejectOnEmpty: true });
    const trainerRevision = await Revision.findOne({ where: { speedBookId: trainerBook.id, status: 'published' }, rejectOnEmpty: true });
    const trainerAirframe = await Airframe.findOne({ where: { aircraftTypeId: trainer.id, active: true }, order: [['id', 'ASC']], rejectOnEmpty: true });
    await issueCard(pilot!, revisionId, cardInputs(airframeId, 1000));
    await issueCard(pilot!, trainerRevision.id, cardInputs(trainerAirframe.id, 950));

    // A device syncs, then the fleet changes once more before the backup.
    const deviceCursor = (await sync(pilot!)).cursor;
    const laterAirframe = await addAirframe(admin!, book.aircraftTypeId);
    const changesSinceCursor = await sync(pilot!, deviceCursor);
    expect(changesSinceCursor.airframes.map((airframe) => airframe.id)).toEqual([laterAirframe]);

    const revisions = (await Revision.findAll({ order: [['id', 'ASC']] })).map((row) => row.get({ plain: true }) as SignedRevisionRow);
    const publicKeys = new Map((await SigningKey.findAll()).map((key) => [key.id, key.publicKey]));
    const attachments = (await Attachment.findAll({ order: [['id', 'ASC']] })).map(({ id, sha256: hash, sizeBytes }) => ({ id, sha256: hash, sizeBytes }));
    const cards = await Promise.all(
      (await CardIssue.findAll({ order: [['code', 'ASC']] })).map(async (card) => ({ code: card.code, registration: (await Airframe.findByPk(card.airframeId, { rejectOnEmpty: true })).registration })),
    );
    return { revisions, publicKeys, attachments, cards, deviceCursor, changesSinceCursor };
  } finally {
    await sourceHarness.close();
  }
}

beforeAll(async () => {
  work = await mkdtemp(join(tmpdir(), 'speedwright-backup-test-'));
  source = await openLocalDatabase('test', SOURCE, { fresh: true });
  const filled = await fillSource();

  backupDir = join(work, 'backup');
  backup = await createBackup({ databaseUrl: source.url, attachmentsDir: sourceAttachments(), outDir: backupDir, appVersion: '0.1.0' });
  const sourceDatabase = await openDatabase(source.url);
  const syncNumbersNext = await nextSyncNumbers(sourceDatabase);
  await sourceDatabase.close();

  // After the backup the fleet changes once more, and a device syncs it: its cursor is beyond the backup.
  const lateHarness = startHarness({ DATABASE_URL: source.url, ATTACHMENTS_DIR: sourceAttachments() });
  const [admin, pilot] = await Promise.all([signIn(lateHarness.app, demoEmail('admin')), signIn(lateHarness.app, demoEmail('pilot'))]);
  await addAirframe(admin, (await AircraftType.findOne({ where: { designator: 'ZZP1' }, rejectOnEmpty: true })).id);
  const cursorAheadOfBackup = (await sync(pilot)).cursor;
  await lateHarness.close();
  facts = { ...filled, syncNumbersNext, cursorAheadOfBackup };

  // The disaster: the database and the attachments are gone.
  await recreateDatabase(source.instance, SOURCE);
  rmSync(sourceAttachments(), { recursive: true, force: true });

  target = await openLocalDatabase('test', TARGET, { fresh: true });
  restored = await restoreBackup({ fromDir: backupDir, databaseUrl: target.url, attachmentsDir: targetAttachments() });
  harness = startHarness({ DATABASE_URL: target.url, ATTACHMENTS_DIR: targetAttachments() });
});

afterAll(async () => {
  await harness?.close();
  for (const name of [SOURCE, TARGET, SPARE]) if (source) await recreateDatabase(source.instance, name);
  if (work) rmSync(work, { recursive: true, force: true });
});

describe('a backup restored into a fresh database', () => {
  it('holds the dump and every attachment, each with its size and SHA-256, and restores them all', () => {
    const paths = backup.manifest.files.map((file) => file.path);
    expect(paths[0]).toBe('database.sql');
    expect(paths.filter((path) => path.startsWith('attachments/'))).toHaveLength(facts.attachments.length);
    expect(facts.attachments).toHaveLength(2);
    expect(backup.manifest.migrations).toEqual(migrationNames());
    expect(backup.recordsWithoutFile).toEqual([]);
    for (const file of backup.manifest.files) {
      const bytes = readFileSync(join(backupDir, file.path));
      expect({ size: bytes.length, sha256: sha256(bytes) }).toEqual({ size: file.sizeBytes, sha256: file.sha256 });
    }
    expect(restored).toMatchObject({ attachmentFiles: 2, attachmentBytes: PDF.length + PNG.length, migrationsRun: [] });
  });

  it('gives back every revision with its content hash and signature, which verify with the operator’s public key', async () => {
    const revisions = (await Revision.findAll({ order: [['id', 'ASC']] })).map((row) => row.get({ plain: true }) as SignedRevisionRow);
    expect(revisions).toEqual(facts.revisions);
    const signed = revisions.filter((revision) => revision.signature !== null);
    // Four from the demo seed (two of the trainer, one of each other demo type), one of this test.
    expect(signed.length).toBe(5);
    for (const revision of signed) {
      expect(contentSha256(JSON.parse(revision.content))).toBe(revision.contentSha256);
      const statement = signedRevisionStatement({
        operatorId: revision.operatorId,
        speedBookId: revision.speedBookId,
        revisionId: revision.id,
        number: revision.number,
        contentSha256: revision.contentSha256!,
        publishedAt: revision.publishedAt!.toISOString(),
      });
      const key = await SigningKey.findByPk(revision.signingKeyId!, { rejectOnEmpty: true });
      expect(key.publicKey).toBe(facts.publicKeys.get(key.id));
      expect(verifyStatement(key.publicKey, statement, revision.signature!)).toBe(true);
    }
  });

  it('serves a device the same signed revisions, which it verifies as a device does (WebCrypto Ed25519)', async () => {
    const pilot = await signIn(harness.app, demoEmail('pilot'));
    const full = await sync(pilot);
    expect(full.revisions.length).toBeGreaterThanOrEqual(4);
    const key = await webcrypto.subtle.importKey('raw', Buffer.from(full.operator.publicKey, 'base64'), { name: 'Ed25519' }, false, ['verify']);
    for (const revision of full.revisions) {
      expect(contentSha256(revision.content)).toBe(revision.contentSha256);
      const statement = signedRevisionStatement({ operatorId: full.operator.id, ...revision, revisionId: revision.id });
      expect(await webcrypto.subtle.verify({ name: 'Ed25519' }, key, Buffer.from(revision.signature, 'base64'), new TextEncoder().encode(statement))).toBe(true);
    }
  });

  it('gives back every attachment file, matching the SHA-256 and size of its record, and serves it', async () => {
    const engineer = await signIn(harness.app, demoEmail('engineer'));
    const attachments = await Attachment.findAll({ order: [['id', 'ASC']] });
    expect(attachments.map(({ id, sha256: hash, sizeBytes }) => ({ id, sha256: hash, sizeBytes }))).toEqual(facts.attachments);
    for (const attachment of attachments) {
      const bytes = readFileSync(join(targetAttachments(), String(attachment.operatorId), attachment.storageName));
      expect({ size: bytes.length, sha256: sha256(bytes) }).toEqual({ size: attachment.sizeBytes, sha256: attachment.sha256 });
      const served = await engineer.agent.get(`/api/attachments/${attachment.id}`).buffer(true).parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
      expect(served.status).toBe(200);
      expect(sha256(served.body as Buffer)).toBe(attachment.sha256);
    }
  });

  it('answers every card code through GET /api/verify/:code as before', async () => {
    expect(facts.cards.length).toBeGreaterThanOrEqual(2);
    for (const card of facts.cards) {
      const res = await request(harness.app).get(`/api/verify/${card.code}`).expect(200);
      expect(res.body).toMatchObject({ status: 'current', registration: card.registration });
    }
  });

  it('continues the sync cursor: a device neither misses nor repeats a change, even one whose cursor is ahead of the backup', async () => {
    // The dump carries every operator's counter row exactly; the restore then moves each on by the gap.
    const dump = readFileSync(join(backupDir, 'database.sql'), 'utf8');
    expect(dump).toMatch(/^INSERT INTO `sync_counters` VALUES\s/m);
    expect(Object.keys(facts.syncNumbersNext).length).toBeGreaterThanOrEqual(2);
    const restoredDatabase = await openDatabase(target.url);
    try {
      const next = await nextSyncNumbers(restoredDatabase);
      const expected = Object.fromEntries(Object.entries(facts.syncNumbersNext).map(([operatorId, number]) => [operatorId, number + RESTORE_SEQUENCE_GAP]));
      expect(next).toEqual(expected);
      expect(restored.syncNumbersNext).toEqual(next);
      const stamps = await restoredDatabase.query<{ operatorId: number; high: number }>(
        'SELECT o.id AS operatorId, GREATEST(COALESCE((SELECT MAX(change_seq) FROM aircraft_types WHERE operator_id = o.id), 0), COALESCE((SELECT MAX(change_seq) FROM airframes WHERE operator_id = o.id), 0), COALESCE((SELECT MAX(change_seq) FROM revisions WHERE operator_id = o.id), 0)) AS high FROM operators o',
        { type: 'SELECT' },
      );
      for (const { operatorId, high } of stamps) expect({ operatorId, above: next[String(operatorId)]! > Number(high) }).toEqual({ operatorId, above: true });
    } finally {
      await restoredDatabase.close();
    }

    const [pilot, admin] = await Promise.all([signIn(harness.app, demoEmail('pilot')), signIn(harness.app, demoEmail('admin'))]);
    // The device's cursor from before the backup gets exactly what it got from the old server.
    const again = await sync(pilot, facts.deviceCursor);
    expect(again).toEqual(facts.changesSinceCursor);
    // A change after the restore is the one thing the next sync brings, and only once.
    const type = await AircraftType.findOne({ where: { designator: 'ZZP1' }, rejectOnEmpty: true });
    const added = await addAirframe(admin, type.id);
    const next = await sync(pilot, again.cursor);
    expect({ types: next.aircraftTypes, airframes: next.airframes.map((airframe) => airframe.id), revisions: next.revisions }).toEqual({ types: [], airframes: [added], revisions: [] });
    expect(await sync(pilot, next.cursor)).toMatchObject({ cursor: next.cursor, aircraftTypes: [], airframes: [], revisions: [] });
    // A device that synced after the backup was made (its change is lost with the old server) still hears of it.
    const ahead = await sync(pilot, facts.cursorAheadOfBackup);
    expect({ types: ahead.aircraftTypes, airframes: ahead.airframes.map((airframe) => airframe.id), revisions: ahead.revisions }).toEqual({ types: [], airframes: [added], revisions: [] });
  });

  it('signs new publications with the restored key (the server needs the same SIGNING_KEY_SECRET)', async () => {
    const [admin, engineer, approver] = await Promise.all(['admin', 'engineer', 'approver'].map((role) => signIn(harness.app, demoEmail(role as 'admin'))));
    const book = await newSpeedBook(admin!, engineer!);
    const id = await publish(engineer!, approver!, book.speedBookId);
    const revision = await Revision.findByPk(id, { rejectOnEmpty: true });
    const key = await SigningKey.findByPk(revision.signingKeyId!, { rejectOnEmpty: true });
    expect(facts.publicKeys.get(key.id)).toBe(key.publicKey);
    const statement = signedRevisionStatement({ ...revision.get({ plain: true }), revisionId: revision.id, contentSha256: revision.contentSha256!, publishedAt: revision.publishedAt!.toISOString() });
    expect(verifyStatement(key.publicKey, statement, revision.signature!)).toBe(true);
  });
});

describe('refusals leave the target as it was', () => {
  let spare: LocalDatabase;
  let spareAttachments: string;
  beforeEach(async () => {
    spare = await openLocalDatabase('test', SPARE, { fresh: true });
    spareAttachments = join(work, `spare-attachments-${randomUUID()}`);
  });

  async function refusal(fromDir: string, databaseUrl = spare.url, attachmentsDir = spareAttachments): Promise<DomainError> {
    const error = await restoreBackup({ fromDir, databaseUrl, attachmentsDir }).then(
      () => undefined,
      (thrown: unknown) => thrown,
    );
    expect(error).toBeInstanceOf(DomainError);
    return error as DomainError;
  }

  async function expectEmpty(databaseUrl: string, attachmentsDir: string): Promise<void> {
    const database = await openDatabase(databaseUrl);
    try {
      expect(await databaseObjects(database)).toEqual({ tables: 0, routines: 0, events: 0 });
    } finally {
      await database.close();
    }
    expect(existsSync(attachmentsDir)).toBe(false);
  }

  function copyOfBackup(): string {
    const copy = join(work, `copy-${randomUUID()}`);
    cpSync(backupDir, copy, { recursive: true });
    return copy;
  }

  it('refuses a backup with one byte of its dump changed, naming the dump', async () => {
    const damaged = copyOfBackup();
    const dump = readFileSync(join(damaged, 'database.sql'));
    dump[Math.floor(dump.length / 2)] = dump[Math.floor(dump.length / 2)]! ^ 0x20;
    writeFileSync(join(damaged, 'database.sql'), dump);
    const error = await refusal(damaged);
    expect(error.code).toBe('backup_damaged');
    expect(error.message).toBe(`database.sql in ${damaged} does not match its SHA-256 in manifest.json: the backup is damaged; nothing was restored.`);
    await expectEmpty(spare.url, spareAttachments);
  });

  it('refuses a backup with an attachment missing, naming it', async () => {
    const partial = copyOfBackup();
    const gone = backup.manifest.files.find((file) => file.path.startsWith('attachments/'))!.path;
    unlinkSync(join(partial, gone));
    const error = await refusal(partial);
    expect(error.code).toBe('backup_incomplete');
    expect(error.message).toBe(`The backup in ${partial} is incomplete: ${gone} is listed in manifest.json but missing; nothing was restored.`);
    await expectEmpty(spare.url, spareAttachments);
  });

  it('refuses to restore into a database that holds anything, and changes nothing in it', async () => {
    const before = await openDatabase(target.url);
    const objects = await databaseObjects(before);
    const revisions = await Revision.count();
    await before.close();
    const error = await refusal(backupDir, target.url);
    expect(error.code).toBe('restore_database_not_empty');
    expect(error.message).toContain(`The database ${TARGET} on 127.0.0.1:`);
    expect(error.message).toContain(`is not empty (${objects.tables} tables)`);
    const after = await openDatabase(target.url);
    expect(await databaseObjects(after)).toEqual(objects);
    await after.close();
    expect(await Revision.count()).toBe(revisions);
    expect(existsSync(spareAttachments)).toBe(false);
  });

  it('refuses an attachments folder that holds anything, and changes nothing', async () => {
    mkdirSync(spareAttachments, { recursive: true });
    writeFileSync(join(spareAttachments, 'kept.txt'), 'already here');
    const error = await refusal(backupDir);
    expect(error.code).toBe('restore_attachments_not_empty');
    expect(error.message).toBe(`The attachments folder ${spareAttachments} is not empty: restore only into an empty or new ATTACHMENTS_DIR; nothing was restored.`);
    expect(readdirSync(spareAttachments)).toEqual(['kept.txt']);
    rmSync(spareAttachments, { recursive: true });
    await expectEmpty(spare.url, spareAttachments);
  });

  it('undoes a restore that MariaDB stops half way, leaving the database and the folder empty again', async () => {
    const broken = copyOfBackup();
    // A whole, consistent backup (the manifest matches) whose dump fails after creating tables.
    writeFileSync(join(broken, 'database.sql'), Buffer.concat([readFileSync(join(broken, 'database.sql')), Buffer.from('\nTHIS IS NOT SQL;\n')]));
    const manifestPath = join(broken, 'manifest.json');
    const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as BackupResult['manifest'];
    const bytes = readFileSync(join(broken, 'database.sql'));
    manifest.files[0] = { path: 'database.sql', sizeBytes: bytes.length, sha256: sha256(bytes) };
    writeFileSync(manifestPath, JSON.stringify(manifest));
    const error = await refusal(broken);
    expect(error.code).toBe('restore_load_failed');
    expect(error.message).toMatch(/^MariaDB did not take the dump into .*: ERROR 1064 \(42000\) at line \d+: You have an error in your SQL syntax/);
    await expectEmpty(spare.url, spareAttachments);
  });

  it('refuses to back up into a folder that already holds files, and leaves it alone', async () => {
    const before = readdirSync(backupDir).sort();
    const error = await createBackup({ databaseUrl: target.url, attachmentsDir: targetAttachments(), outDir: backupDir, appVersion: '0.1.0' }).then(
      () => undefined,
      (thrown: unknown) => thrown as DomainError,
    );
    expect(error?.code).toBe('backup_target_not_empty');
    expect(error?.message).toBe(`${backupDir} already holds files: back up into a new or empty folder, so that no two backups mix.`);
    expect(readdirSync(backupDir).sort()).toEqual(before);
  });

  it('leaves no partial backup behind when it stops half way (a link in ATTACHMENTS_DIR, after the dump)', async () => {
    const linked = join(work, `linked-attachments-${randomUUID()}`);
    mkdirSync(join(linked, '1'), { recursive: true });
    writeFileSync(join(linked, '1', 'page'), PDF);
    symlinkSync('/etc/hostname', join(linked, '1', 'elsewhere'));
    const outDir = join(work, `stopped-${randomUUID()}`);
    const made = await createBackup({ databaseUrl: target.url, attachmentsDir: linked, outDir, appVersion: '0.1.0' }).then(
      () => undefined,
      (thrown: unknown) => thrown as DomainError,
    );
    expect(made?.code).toBe('not_a_file');
    expect(made?.message).toBe(`${join(linked, '1', 'elsewhere')} is a symbolic link; only regular files are backed up and restored.`);
    expect(existsSync(outDir)).toBe(false);
    // A folder made for the backup stays, empty.
    mkdirSync(outDir);
    await expect(createBackup({ databaseUrl: target.url, attachmentsDir: linked, outDir, appVersion: '0.1.0' })).rejects.toThrow('is a symbolic link');
    expect(readdirSync(outDir)).toEqual([]);
  });

  it('says which attachment records have no file in ATTACHMENTS_DIR (a folder set wrongly, a file lost)', async () => {
    const partialFolder = join(work, `partial-attachments-${randomUUID()}`);
    cpSync(targetAttachments(), partialFolder, { recursive: true });
    const lost = await Attachment.findOne({ order: [['id', 'ASC']], rejectOnEmpty: true });
    unlinkSync(join(partialFolder, String(lost.operatorId), lost.storageName));
    const made = await createBackup({ databaseUrl: target.url, attachmentsDir: partialFolder, outDir: join(work, `warned-${randomUUID()}`), appVersion: '0.1.0' });
    expect(made.recordsWithoutFile).toEqual([`${lost.operatorId}/${lost.storageName}`]);
    expect(made.attachmentFiles).toBe(facts.attachments.length - 1);
  });

  it('ends the commands with exit code 1 and one sentence, no stack trace', async () => {
    const damaged = copyOfBackup();
    const dump = readFileSync(join(damaged, 'database.sql'));
    dump[100] = dump[100]! ^ 0x01;
    writeFileSync(join(damaged, 'database.sql'), dump);
    const tsx = join(__dirname, '..', '..', 'node_modules', '.bin', 'tsx');
    const env = { ...process.env, DATABASE_URL: spare.url, ATTACHMENTS_DIR: spareAttachments };
    const restoreRun = spawnSync(tsx, [join(__dirname, 'restore-cli.ts'), '--from', damaged], { env, encoding: 'utf8' });
    expect({ status: restoreRun.status, stdout: restoreRun.stdout, stderr: restoreRun.stderr }).toEqual({
      status: 1,
      stdout: '',
      stderr: `database.sql in ${damaged} does not match its SHA-256 in manifest.json: the backup is damaged; nothing was restored.\n`,
    });
    const backupRun = spawnSync(tsx, [join(__dirname, 'backup-cli.ts'), '--out', backupDir], { env, encoding: 'utf8' });
    expect({ status: backupRun.status, stderr: backupRun.stderr }).toEqual({ status: 1, stderr: `${backupDir} already holds files: back up into a new or empty folder, so that no two backups mix.\n` });
    const check = spawnSync(tsx, [join(__dirname, 'check-cli.ts'), '--from', damaged], { env, encoding: 'utf8' });
    expect({ status: check.status, stderr: check.stderr }).toEqual({ status: 1, stderr: restoreRun.stderr });
    const whole = spawnSync(tsx, [join(__dirname, 'check-cli.ts'), '--from', backupDir], { env, encoding: 'utf8' });
    expect({ status: whole.status, stderr: whole.stderr }).toEqual({ status: 0, stderr: '' });
    expect(whole.stdout).toMatch(new RegExp(`^The backup in ${backupDir} is whole: 3 files \\(\\d+(\\.\\d)? kB\\) match manifest\\.json, made .+ by Speedwright 0\\.1\\.0; this version can restore it\\.\\n$`));
    const usage = spawnSync(tsx, [join(__dirname, 'backup-cli.ts'), '--into', backupDir], { env, encoding: 'utf8' });
    expect({ status: usage.status, stderr: usage.stderr }).toEqual({ status: 1, stderr: 'Usage: npm run backup -- --out <new folder>\n' });
    await expectEmpty(spare.url, spareAttachments);
  });
});

describe('a backup from an older version', () => {
  it('is restored, then brought up to this version by the migrations it lacks', async () => {
    const names = migrationNames();
    const older = await openLocalDatabase('test', SPARE, { fresh: true });
    const migrating = createSequelize(older.url);
    await createMigrator(migrating).up({ to: names[names.length - 2]! });
    await migrating.close();
    const olderBackup = await createBackup({ databaseUrl: older.url, attachmentsDir: join(work, 'no-attachments'), outDir: join(work, 'older-backup'), appVersion: '0.0.9' });
    expect(olderBackup.manifest.migrations).toEqual(names.slice(0, -1));
    expect(olderBackup.attachmentFiles).toBe(0);

    const fresh = await openLocalDatabase('test', SPARE, { fresh: true });
    const result = await restoreBackup({ fromDir: join(work, 'older-backup'), databaseUrl: fresh.url, attachmentsDir: join(work, 'older-attachments') });
    expect(result.migrationsRun).toEqual(names.slice(-1));
    const database = await openDatabase(fresh.url);
    try {
      expect(await appliedMigrations(database)).toEqual([...names].sort());
    } finally {
      await database.close();
    }
  });
});
