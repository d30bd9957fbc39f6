/**
 * The envelope proof over HTTP (issue 11): `GET /api/revisions/:id/coverage`,
 * `POST /api/revisions/coverage`, and the 422 `coverage_failed` of submit and publish, which
 * carries the report and leaves the revision as it was.
 */
import type { CoverageReport } from '@shared/card/coverage-report';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import type { RevisionContent } from '@shared/speed-book/revision-content';
import { startHarness, type Harness } from '../../test/api/harness';
import { AuditEvent, Revision } from '../models';
import { newSpeedBook, publish, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

const write = (who: Session, method: 'post' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.token);

/** The demo trainer with VR tabulated only up to 4,000 ft while its envelope declares 10,000 ft: a hole. */
function trainerWithGap(): RevisionContent {
  const content = demoPistonTrainerContent();
  content.speeds = content.speeds.map((speed) =>
    speed.code === 'VR'
      ? { code: 'VR', label: 'Rotate', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'tabulated', byWeightKg: [700, 1100], byPressureAltitudeFt: [-1500, 4000], valuesKt: [[45, 46], [55, 56]] }
      : speed,
  );
  return content;
}

async function draftOf(content: RevisionContent): Promise<number> {
  const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
  const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content, changeSummary: 'Coverage test' }).expect(201);
  return draft.body.revision.id as number;
}

describe('POST /api/revisions/coverage (unsaved editor content)', () => {
  it('sweeps sound content: every point issued, the report passes', async () => {
    const res = await write(as.engineer, 'post', '/api/revisions/coverage').send({ content: demoPistonTrainerContent() }).expect(200);
    const report = res.body.report as CoverageReport;
    expect(report.passes).toBe(true);
    expect(report.counts.refused).toBe(0);
    expect(report.sheets.map((sheet) => sheet.phase)).toEqual(['takeoff', 'landing']);
  });

  it('shows the hole of a takeoff table: the points above 4,000 ft refused, with the table’s reason', async () => {
    const report = (await write(as.approver, 'post', '/api/revisions/coverage').send({ content: trainerWithGap() }).expect(200)).body.report as CoverageReport;
    expect(report.passes).toBe(false);
    const refused = report.sheets[0].cells.filter((cell) => cell.outcome === 'refused');
    expect(refused.length).toBeGreaterThan(0);
    expect(refused.every((cell) => cell.pressureAltitudeFt > 4000)).toBe(true);
    expect(refused[0].reason).toMatch(/^VR \(Rotate\): A pressure altitude of .* is outside the flight manual's table/);
  });

  it('answers 422 with the field problems when the content does not parse, 400 without content', async () => {
    const broken = demoPistonTrainerContent();
    delete (broken.limits as { vneKt?: number }).vneKt;
    const res = await write(as.engineer, 'post', '/api/revisions/coverage').send({ content: broken }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'content_invalid', fields: { 'content.limits.vneKt': 'A piston type needs VNE.' } });
    await write(as.engineer, 'post', '/api/revisions/coverage').send({}).expect(400);
  });

  it('is for engineers and approvers, with the CSRF token', async () => {
    await write(as.pilot, 'post', '/api/revisions/coverage').send({ content: demoPistonTrainerContent() }).expect(403);
    await as.engineer.agent.post('/api/revisions/coverage').send({ content: demoPistonTrainerContent() }).expect(403);
  });
});

describe('GET /api/revisions/:id/coverage', () => {
  it('gives the report to anyone who may read the revision: pilots see published ones, not drafts', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const published = await publish(as.engineer, as.approver, speedBookId);
    const report = (await as.pilot.agent.get(`/api/revisions/${published}/coverage`).expect(200)).body.report as CoverageReport;
    expect(report).toMatchObject({ passes: true, envelope: { takeoff: { pressureAltitudeFt: [-1500, 10000] } } });

    const draft = await draftOf(trainerWithGap());
    await as.pilot.agent.get(`/api/revisions/${draft}/coverage`).expect(404);
    expect((await as.engineer.agent.get(`/api/revisions/${draft}/coverage`).expect(200)).body.report.passes).toBe(false);
  });

  it('answers 422 with the fields for a draft that is not complete yet', async () => {
    const content = demoPistonTrainerContent();
    delete (content.limits as { vneKt?: number }).vneKt;
    const draft = await draftOf(content);
    const res = await as.engineer.agent.get(`/api/revisions/${draft}/coverage`).expect(422);
    expect(res.body.error.fields).toMatchObject({ 'content.limits.vneKt': 'A piston type needs VNE.' });
  });
});

describe('submit and publish require the envelope proof', () => {
  it('refuses to submit a draft with a hole: 422 coverage_failed with the report, and the draft stays a draft', async () => {
    const id = await draftOf(trainerWithGap());
    const res = await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(422);
    expect(res.body.error).toMatchObject({ code: 'coverage_failed', message: expect.stringMatching(/^The revision cannot be submitted: \d+ of \d+ points inside the envelope give no card\./) });
    const report = res.body.error.report as CoverageReport;
    expect(report.passes).toBe(false);
    expect(report.counts.refused).toBeGreaterThan(0);
    expect((await Revision.findByPk(id, { rejectOnEmpty: true })).status).toBe('draft');
    expect(await AuditEvent.count({ where: { entityType: 'revision', entityId: id, action: 'revision.submitted' } })).toBe(0);
  });

  it('asks for a declared envelope before submit', async () => {
    const content = demoPistonTrainerContent();
    delete content.envelope;
    const id = await draftOf(content);
    const res = await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(422);
    expect(res.body.error).toMatchObject({ code: 'content_invalid', fields: { 'content.envelope': expect.stringMatching(/^Declare the takeoff and landing/) } });
  });

  it('lets a rule with the flight manual’s reason recorded through, and the approver sees the reason in the report', async () => {
    const content = demoPistonTrainerContent();
    content.speeds = content.speeds.map((speed) => (speed.code === 'VX' && speed.kind === 'scaled' ? { ...speed, referenceKt: 80 } : speed)); // VX 80 > VY 76
    const id = await draftOf(content);
    const refused = await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(422);
    expect(refused.body.error.message).toMatch(/VX ≤ VY is broken without a recorded exception/);
    expect(refused.body.error.report.rules).toEqual([expect.objectContaining({ ruleId: 'vx-vy', title: 'VX ≤ VY', source: expect.stringMatching(/FAA/) })]);

    content.ruleExceptions = [{ ruleId: 'vx-vy', reason: 'Flight manual section 4 gives VX with flaps 10°, above VY clean.' }];
    await write(as.engineer, 'patch', `/api/revisions/${id}`).send({ content }).expect(200);
    await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(200);
    const report = (await as.approver.agent.get(`/api/revisions/${id}/coverage`).expect(200)).body.report as CoverageReport;
    expect(report.passes).toBe(true);
    expect(report.rules[0]).toMatchObject({ ruleId: 'vx-vy', exception: expect.stringMatching(/section 4/) });
    await write(as.approver, 'post', `/api/revisions/${id}/approve`).expect(200);
  });

  it('re-checks at publish: content that no longer covers its envelope is not published', async () => {
    const id = await draftOf(demoPistonTrainerContent());
    await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(200);
    // The content changed under the review (as a database edit would): publish sweeps again.
    await (await Revision.findByPk(id, { rejectOnEmpty: true })).update({ content: JSON.stringify(trainerWithGap()) });
    const res = await write(as.approver, 'post', `/api/revisions/${id}/approve`).expect(422);
    expect(res.body.error).toMatchObject({ code: 'coverage_failed', message: expect.stringMatching(/^The revision cannot be published/) });
    expect((await Revision.findByPk(id, { rejectOnEmpty: true })).status).toBe('in_review');
  });
});
