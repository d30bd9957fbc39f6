/**
 * `/api/airframes/:id/card.pdf` against the test database: the engineers' batch print (POST
 * issues, GET prints an issued card again and never writes), its field-level refusals, who may
 * print, and the PDF itself read back with pdf-parse.
 */
import jsQR from 'jsqr';
import request from 'supertest';
import { checkUrl } from '@shared/card-check/check-url';
import { airframeListSchema, aircraftTypeListSchema } from '@shared/api/fleet';
import { revisionResponseSchema, speedBookListSchema } from '@shared/api/revisions';
import { formatCardCode, generateCardCode, isCardCode } from '@shared/card-check/card-code';
import { buildCard } from '@shared/card/build-card';
import { SAFETY_CAUTION } from '@shared/card/card-presentation';
import { cardIssuePageSchema } from '@shared/card/card-api';
import { csrfAgent, startHarness, TEST_PUBLIC_URL, type Harness } from '../../test/api/harness';
import { CardIssue } from '../models';
import { readPdf } from '../../test/api/read-pdf';
import { newSpeedBook, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(90_000);

// pngjs comes with qrcode (its PNG renderer; no typings of its own): it reads pdf.js's rendering back.
const { PNG } = require('pngjs') as { PNG: { sync: { read(png: Buffer): { width: number; height: number; data: Buffer } } } };

let harness: Harness;
let as: SessionsByRole;
let trainerId: number;
let trainerRevision: { id: number; number: number; content: unknown; contentSha256: string | null; publishedAt: string | null };
let secondOperatorAirframeId: number;
let trainerContext: { airframe: { id: number; registration: string }; aircraftType: { designator: string; name: string }; speedBook: { id: number; title: string }; demo: boolean };

// Invented demo data — not for flight: the demo trainer (ZZ-KFA), revision 2 of its book.
const QUERY = {
  weightKg: '1050',
  landingWeightKg: '1000',
  configuration: 'takeoff-flap',
  'departure.elevationFt': '500',
  'departure.qnhHpa': '1008',
  'departure.oatC': '22',
  isaDeviationC: '5',
  'cruise.iasKt': '105',
  altitudeStepFt: '2000',
};
const INPUTS = (airframeId: number) => ({
  airframeId,
  weightKg: 1050,
  landingWeightKg: 1000,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 500, qnhHpa: 1008, oatC: 22 },
  isaDeviationC: 5,
  cruise: { iasKt: 105 },
  altitudeStepFt: 2000,
});

const url = (airframeId: number, query: Record<string, string> = QUERY) => `/api/airframes/${airframeId}/card.pdf?${new URLSearchParams(query)}`;
/** Issuing is a write: POST with the session's CSRF token. */
const issue = (who: Session, path: string) => who.agent.post(path).set('x-csrf-token', who.token);

/** supertest keeps a PDF body as a Buffer with this parser. */
function binary(res: NodeJS.ReadableStream & { setEncoding(e: string): void }, done: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(Buffer.from(chunk)));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
  const types = aircraftTypeListSchema.parse((await as.engineer.agent.get('/api/aircraft-types').expect(200)).body).aircraftTypes;
  const airframes = airframeListSchema.parse((await as.engineer.agent.get('/api/airframes').expect(200)).body).airframes;
  const books = speedBookListSchema.parse((await as.engineer.agent.get('/api/speed-books').expect(200)).body).speedBooks;
  trainerId = airframes.find((a) => a.registration === 'ZZ-KFA')!.id;
  const typeId = types.find((type) => type.designator === 'ZZP1')!.id;
  const book = books.find((b) => b.aircraftTypeId === typeId)!;
  const current = book.currentRevision!;
  trainerContext = { airframe: { id: trainerId, registration: 'ZZ-KFA' }, aircraftType: { designator: 'ZZP1', name: types.find((type) => type.id === typeId)!.name }, speedBook: { id: book.id, title: book.title }, demo: true };
  trainerRevision = revisionResponseSchema.parse((await as.engineer.agent.get(`/api/revisions/${current.id}`).expect(200)).body).revision;
  const second = airframeListSchema.parse((await as.secondAdmin.agent.get('/api/airframes').expect(200)).body).airframes;
  secondOperatorAirframeId = second[0].id;
});
afterAll(() => harness.close());

describe('/api/airframes/:id/card.pdf', () => {
  it('issues the card of the current revision on POST as a PDF named <registration>-rev<N>-<date>.pdf, and records it in the card log', async () => {
    const res = await issue(as.engineer, url(trainerId)).buffer(true).parse(binary).expect(201);
    expect(res.headers['content-type']).toBe('application/pdf');
    const today = new Date().toISOString().slice(0, 10);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="ZZ-KFA-rev${trainerRevision.number}-${today}.pdf"`);
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');

    // The same card the device computes from the same revision and inputs.
    const expected = buildCard(
      { id: trainerRevision.id, number: trainerRevision.number, publishedAt: trainerRevision.publishedAt, contentSha256: trainerRevision.contentSha256!, content: trainerRevision.content },
      INPUTS(trainerId),
      trainerContext,
    );
    const code = String(res.headers['x-card-code']);
    expect(isCardCode(code)).toBe(true);

    const reading = await readPdf(pdf, { page1Png: true });
    {
      const text = reading.text;
      const flat = text.replace(/\s+/g, ' ');
      expect(flat).toContain('ZZ-KFA');
      expect(flat).toContain(`revision ${trainerRevision.number}`);
      expect(flat).toContain(formatCardCode(code));
      expect(flat).toContain(SAFETY_CAUTION);
      expect(flat).toContain('INVENTED DEMO DATA — NOT FOR FLIGHT');
      for (const speed of expected.speeds) expect(flat).toContain(`${speed.code} ${speed.label}`);
      const vr = expected.speeds.find((speed) => speed.code === 'VR')!;
      expect(flat).toContain(`VR Rotate · ${vr.configurationLabel} ${vr.weightKg.toLocaleString('en-US')} ${vr.iasKt} ${vr.casKt}`);
      // Revision 2 changed VR and VX (db/seed.ts): the footnote explains the bars.
      expect(flat).toContain(`differs from revision ${trainerRevision.number - 1} for the same inputs`);
      expect(flat).not.toMatch(/NaN|undefined|Infinity/);
      // The QR code holds the check URL; the words beside it name the operator's host.
      expect(flat).toContain(`${new URL(TEST_PUBLIC_URL).host}/check`);
      expect(reading.info['Title']).toBe(`ZZ-KFA speed card, revision ${trainerRevision.number}`);
    }
    // The QR code on the printed page, rendered by pdf.js and read by jsQR (a reference decoder),
    // is the card's check URL on the operator's host.
    const png = PNG.sync.read(reading.page1Png!);
    const scanned = jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data;
    expect(scanned).toBe(checkUrl(new URL(TEST_PUBLIC_URL).origin, code, { revisionId: trainerRevision.id, inputs: INPUTS(trainerId), digest: expected.digest }));
    // Every face embedded as a TrueType font program (PDF 1.7, 9.8.1: FontFile2).
    const raw = pdf.toString('latin1');
    expect(raw.match(/\/FontFile2/g)).toHaveLength(4);
    expect((raw.match(/\/FontName \/[A-Z]{6}\+[A-Za-z-]+/g) ?? []).map((name) => name.split('+')[1]).sort()).toEqual(['Roboto-Bold', 'Roboto-Regular', 'RobotoMono-Bold', 'RobotoMono-Regular']);

    // The printed code is in the card log with the card's digest, so the check page can find it.
    const log = cardIssuePageSchema.parse((await as.engineer.agent.get(`/api/card-issues?airframeId=${trainerId}&limit=5`).expect(200)).body);
    const entry = log.entries.find((e) => e.code === code)!;
    expect(entry).toMatchObject({ digest: expected.digest, revision: { id: trainerRevision.id } });
    expect(entry.inputs).toEqual(INPUTS(trainerId));
    expect(res.headers['location']).toBe(`/api/airframes/${trainerId}/card.pdf?code=${code}`);
  });

  it('prints an issued card again on GET by its code, and a GET never writes (security issue 12, finding 6)', async () => {
    const issued = await issue(as.approver, url(trainerId)).buffer(true).parse(binary).expect(201);
    const code = String(issued.headers['x-card-code']);
    const entries = await CardIssue.count();

    const again = await as.engineer.agent.get(String(issued.headers['location'])).buffer(true).parse(binary).expect(200);
    expect(again.headers['x-card-code']).toBe(code);
    const flat = (await readPdf(again.body as Buffer)).text.replace(/\s+/g, ' ');
    expect(flat).toContain(formatCardCode(code));
    expect(flat).toContain('as published on the server; reprinted.');
    expect(flat).toContain(SAFETY_CAUTION);

    // The old cross-site link (inputs in a GET) issues nothing: it is refused, field by field.
    const link = await as.engineer.agent.get(url(trainerId)).expect(400);
    expect(link.body.error.fields).toMatchObject({
      code: 'Give the code of the issued card to print (code=K7M-4RT-X9X); issue a new card with POST.',
      weightKg: 'A GET prints a card already issued, by its code; issue a new card with POST and the card inputs.',
    });
    await as.engineer.agent.get(`/api/airframes/${trainerId}/card.pdf?code=${generateCardCode()}`).expect(404);
    await as.engineer.agent.get(`/api/airframes/${secondOperatorAirframeId}/card.pdf?code=${code}`).expect(404);
    expect(await CardIssue.count()).toBe(entries);

    // And a POST without the CSRF token issues nothing either.
    await as.engineer.agent.post(url(trainerId)).expect(403);
    expect(await CardIssue.count()).toBe(entries);
  });

  it('makes each size, the two-up sheets landscape', async () => {
    for (const [paper, width, height] of [['a5', 419.53, 595.28], ['two-up-letter', 792, 612], ['two-up-a4', 841.89, 595.28]] as const) {
      const res = await issue(as.approver, url(trainerId, { ...QUERY, paper })).buffer(true).parse(binary).expect(201);
      const box = (res.body as Buffer).toString('latin1').match(/\/MediaBox \[0 0 ([0-9.]+) ([0-9.]+)\]/)!;
      expect(Number(box[1])).toBeCloseTo(width, 1);
      expect(Number(box[2])).toBeCloseTo(height, 1);
    }
  });

  it('names each bad or missing query parameter in a 400', async () => {
    const { weightKg: _left, ...withoutWeight } = QUERY;
    const res = await issue(as.engineer, url(trainerId, { ...withoutWeight, 'departure.qnhHpa': 'high', colour: 'red', paper: 'b5' })).expect(400);
    expect(res.body.error.fields).toEqual({
      weightKg: 'Give the takeoff weight in kg.',
      'departure.qnhHpa': 'The QNH in hPa must be a number.',
      colour: 'This field is not expected here.',
      paper: 'The paper is one of half-letter, a5, two-up-letter, two-up-a4.',
    });
    const twice = await issue(as.engineer, `${url(trainerId)}&weightKg=900`).expect(400);
    expect(twice.body.error.fields).toEqual({ weightKg: 'Give weightKg once.' });
  });

  it('refuses inputs outside the flight manual data with 422 and the field at fault', async () => {
    const res = await issue(as.engineer, url(trainerId, { ...QUERY, weightKg: '1500' })).expect(422);
    expect(res.body.error.code).toBe('card_refused');
    expect(Object.keys(res.body.error.fields)).toEqual(['weightKg']);
  });

  it('is for engineers and approvers: 403 for a pilot, 401 signed out', async () => {
    await issue(as.pilot, url(trainerId)).expect(403);
    await issue(as.inspector, url(trainerId)).expect(403);
    const signedOut = await csrfAgent(harness.app);
    await signedOut.agent.post(url(trainerId)).set('x-csrf-token', signedOut.token).expect(401);
    await request(harness.app).get(`/api/airframes/${trainerId}/card.pdf?code=${generateCardCode()}`).expect(401);
  });

  it('answers 404 for another operator’s airframe and 409 where the type has no published revision', async () => {
    await issue(as.engineer, url(secondOperatorAirframeId)).expect(404);
    const { aircraftTypeId } = await newSpeedBook(as.admin, as.engineer);
    const created = await as.admin.agent
      .post('/api/airframes')
      .set('x-csrf-token', as.admin.token)
      .send({ registration: `ZZ-Q${String.fromCharCode(65 + (Date.now() % 26))}${String.fromCharCode(65 + (Math.floor(Date.now() / 26) % 26))}`, serial: `S-${Date.now()}`, aircraftTypeId })
      .expect(201);
    const res = await issue(as.engineer, url(created.body.airframe.id)).expect(409);
    expect(res.body.error.code).toBe('no_published_revision');
  });
});
