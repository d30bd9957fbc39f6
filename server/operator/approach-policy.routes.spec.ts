/**
 * The operator's approach additive policy through `GET`/`PATCH /api/operator/settings` against the
 * test database: only an administrator writes it, every value is bounded with a field-level 400,
 * it is audited, it reaches devices in `GET /api/sync`, and the server's printed card
 * (`POST /api/airframes/:id/card.pdf`) uses it and records it in the card's inputs, so a card
 * keeps the policy it was made with. Policy numbers below are the test operator's own; the
 * defaults are the common practice (from memory): ½ headwind + the whole gust, 5 to 20 kt.
 */
import { writeFileSync } from 'node:fs';
import { syncResponseSchema } from '@shared/api/sync';
import { airframeListSchema } from '@shared/api/fleet';
import { cardIssuePageSchema } from '@shared/card/card-api';
import { startHarness, type Harness } from '../../test/api/harness';
import { readPdf } from '../../test/api/read-pdf';
import { signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';
import { AuditEvent } from '../models';

jest.setTimeout(90_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

const COMMON_PRACTICE = { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 };
/** The test operator's own numbers: a third of the headwind, half the gust, 3 to 15 kt. */
const OPERATORS_POLICY = { headwindFraction: 1 / 3, gustFraction: 0.5, minimumKt: 3, maximumKt: 15 };

const patch = (who: Session, body: unknown) => who.agent.patch('/api/operator/settings').set('x-csrf-token', who.token).send(body as object);

/** supertest keeps a PDF body as a Buffer with this parser. */
function binary(res: NodeJS.ReadableStream & { setEncoding(e: string): void }, done: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(Buffer.from(chunk)));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

describe('the approach additive policy in the operator settings', () => {
  it('starts at the common practice, is changed by an administrator only, audited, and reaches devices in the sync', async () => {
    expect((await as.admin.agent.get('/api/operator/settings').expect(200)).body.settings.approachAdditivePolicy).toEqual(COMMON_PRACTICE);
    for (const role of ['pilot', 'engineer', 'approver', 'inspector'] as const) await patch(as[role], { approachAdditivePolicy: OPERATORS_POLICY }).expect(403);

    const res = await patch(as.admin, { approachAdditivePolicy: OPERATORS_POLICY }).expect(200);
    // Changing only the policy leaves the currency limit as it was.
    expect(res.body.settings).toEqual({ currencyLimitDays: 30, approachAdditivePolicy: OPERATORS_POLICY });
    const synced = syncResponseSchema.parse((await as.pilot.agent.get('/api/sync').expect(200)).body);
    expect(synced.operator.approachAdditivePolicy).toEqual(OPERATORS_POLICY);
    const audit = await AuditEvent.findOne({ where: { operatorId: synced.operator.id, action: 'operator.settings-updated' }, order: [['id', 'DESC']] });
    expect(JSON.parse(audit!.details!)).toEqual({ approachAdditivePolicy: { before: COMMON_PRACTICE, after: OPERATORS_POLICY } });
    // Another operator keeps its own.
    expect(syncResponseSchema.parse((await as.secondPilot.agent.get('/api/sync').expect(200)).body).operator.approachAdditivePolicy).toEqual(COMMON_PRACTICE);
    await patch(as.admin, { approachAdditivePolicy: COMMON_PRACTICE }).expect(200);
  });

  it.each([
    [{ ...COMMON_PRACTICE, maximumKt: 4 }, 'approachAdditivePolicy.maximumKt', /at least the minimum/],
    [{ ...COMMON_PRACTICE, headwindFraction: 1.2 }, 'approachAdditivePolicy.headwindFraction', /at most 1/],
    [{ ...COMMON_PRACTICE, gustFraction: -0.1 }, 'approachAdditivePolicy.gustFraction', /0 or more/],
    [{ ...COMMON_PRACTICE, maximumKt: 31 }, 'approachAdditivePolicy.maximumKt', /at most 30 kt/],
    [{ ...COMMON_PRACTICE, minimumKt: '5' }, 'approachAdditivePolicy.minimumKt', /number/],
    [{ headwindFraction: 0.5, gustFraction: 1, minimumKt: 5 }, 'approachAdditivePolicy.maximumKt', /Give the maximum additive/],
    [{ ...COMMON_PRACTICE, extra: 1 }, 'approachAdditivePolicy.extra', /not expected/],
  ])('refuses %j with a sentence at its field', async (policy, field, sentence) => {
    const answer = await patch(as.admin, { approachAdditivePolicy: policy }).expect(400);
    expect(answer.body.error.fields[field]).toMatch(sentence);
  });
});

describe('the printed card with a wind', () => {
  it('uses the operator’s policy as it is when the card is issued, and keeps it after the policy changes', async () => {
    const airframes = airframeListSchema.parse((await as.engineer.agent.get('/api/airframes').expect(200)).body).airframes;
    const trainerId = airframes.find((a) => a.registration === 'ZZ-KFA')!.id;
    await patch(as.admin, { approachAdditivePolicy: OPERATORS_POLICY }).expect(200);
    // Invented demo data — not for flight: the demo trainer, runway 270, wind 300/20G30 at the (only) aerodrome.
    const query = new URLSearchParams({
      weightKg: '1050', landingWeightKg: '1000', configuration: 'takeoff-flap',
      'departure.elevationFt': '500', 'departure.qnhHpa': '1008', 'departure.oatC': '22',
      'departure.runwayHeadingDeg': '270', 'departure.wind.directionDeg': '300', 'departure.wind.speedKt': '20', 'departure.wind.gustKt': '30',
      isaDeviationC: '5', 'cruise.iasKt': '105', altitudeStepFt: '2000',
    });
    const res = await as.engineer.agent.post(`/api/airframes/${trainerId}/card.pdf?${query}`).set('x-csrf-token', as.engineer.token).buffer(true).parse(binary).expect(201);
    const code = String(res.headers['x-card-code']);
    const log = cardIssuePageSchema.parse((await as.engineer.agent.get(`/api/card-issues?airframeId=${trainerId}&limit=5`).expect(200)).body);
    const entry = log.entries.find((e) => e.code === code)!;
    expect(entry.inputs).toMatchObject({ departure: { runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } }, approachAdditivePolicy: OPERATORS_POLICY });
    // ⅓ × 20·cos 30° + ½ × (30 − 20) = 5.774 + 5 = 10.774 → 11 kt (rounded up)
    const reading = await readPdf(res.body as Buffer);
    // WIND_PDF_OUT=<file> keeps the PDF to look at (pdftoppm -r 110 -png <file> page).
    if (process.env['WIND_PDF_OUT']) writeFileSync(process.env['WIND_PDF_OUT'], res.body as Buffer);
    const flat = reading.text.replace(/\s+/g, ' ');
    expect(flat).toContain('Approach: VREF + 11 kt, by the operator’s policy (0.333 × headwind + ½ gust, 3–15 kt; departure wind).');
    // The demo trainer's VREF (flaps 30°) at 1,000 kg is printed beside its approach speed, VREF + 11.
    const vref = /VREF Final approach, flaps 30° · Flaps 30° Approach (\d+) KIAS = VREF \+ 11 1,000 (\d+)/.exec(flat);
    expect(vref).not.toBeNull();
    expect(Number(vref![1])).toBe(Number(vref![2]) + 11);
    // runway 270, wind 300/20G30: 20·cos 30° = 17.3 → head 17; 20·sin 30° = 10 from the right; gusts 30·cos 30° = 26, 30·sin 30° = 15
    expect(flat).toContain('Departure wind rwy 270°M · 300°M 20G30 kt · head 17 · cross 10 R');
    expect(flat).toContain('in the gusts head 26, cross 15');
    // The half-letter card keeps to its two pages (front and back) with the wind on it.
    expect(reading.pages).toBe(2);

    // The operator changes its policy; the card issued before keeps the one it used.
    await patch(as.admin, { approachAdditivePolicy: COMMON_PRACTICE }).expect(200);
    const again = await as.engineer.agent.get(`/api/airframes/${trainerId}/card.pdf?code=${code}`).buffer(true).parse(binary).expect(200);
    expect((await readPdf(again.body as Buffer)).text.replace(/\s+/g, ' ')).toContain('Approach: VREF + 11 kt, by the operator’s policy');
    // A field of the policy in the query is not taken: the operator's policy is.
    const forced = await as.engineer.agent.post(`/api/airframes/${trainerId}/card.pdf?${query}&approachAdditivePolicy.minimumKt=0`).set('x-csrf-token', as.engineer.token).expect(400);
    expect(forced.body.error.fields['approachAdditivePolicy.minimumKt']).toMatch(/operator’s approach additive policy/);
  });
});
