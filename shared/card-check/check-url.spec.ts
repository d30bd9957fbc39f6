/**
 * The check URL and its compact payload: round trips of real cards' inputs (built with
 * buildCard from the hand-worked test types), the URL-safe alphabet of RFC 3986 §2.3
 * (unreserved characters), base64url of RFC 4648 §5 checked against Node's Buffer (a reference
 * implementation), and every way a damaged payload is told in a sentence.
 */
import fc from 'fast-check';
import { buildCard } from '../card/build-card';
import { cardInputsSchema, type CardInputs } from '../card/card';
import { HAND_CONTEXT, handJetContent, handPistonContent, handPistonInputs, revisionOf } from '../card/testing/test-fixtures';
import { demoTwinTurbopropContent } from '../speed-book/demo-content';
import { generateCardCode } from './card-code';
import {
  base64UrlToDigest,
  checkUrl,
  decodeCheckPayload,
  digestToBase64Url,
  encodeCheckPayload,
  parseCheckUrl,
  type CheckPayload,
} from './check-url';

const pistonRevision = revisionOf(handPistonContent());
const pistonCard = buildCard(pistonRevision, handPistonInputs(), HAND_CONTEXT);
const pistonPayload: CheckPayload = { revisionId: pistonRevision.id, inputs: pistonCard.inputs, digest: pistonCard.digest };

const jetInputs: CardInputs = {
  airframeId: 7,
  weightKg: 7200.5,
  configuration: 'flap',
  departure: { elevationFt: -12, qnhHpa: 1009.8, oatC: -3.5, dewPointC: -7.25 },
  arrival: { elevationFt: 5430, qnhHpa: 1021, oatC: 31.2 },
  isaDeviationC: -4.5,
  cruise: { mach: 0.72 },
  altitudeStepFt: 5000,
};
const jetRevision = revisionOf(handJetContent(), 12, 4);
const jetCard = buildCard(jetRevision, jetInputs, HAND_CONTEXT);
const jetPayload: CheckPayload = { revisionId: jetRevision.id, inputs: jetCard.inputs, digest: jetCard.digest };

/** RFC 3986 §2.3 unreserved characters: nothing in them is ever percent-encoded. */
const UNRESERVED = /^[A-Za-z0-9._~-]+$/;

describe('the compact payload', () => {
  it.each([
    ['a piston card (landing weight, no arrival, IAS cruise)', pistonPayload],
    ['a jet card (arrival, dew point, Mach cruise, negative figures)', jetPayload],
  ])('round-trips %s to the same inputs, revision and digest', (_what, payload) => {
    const text = encodeCheckPayload(payload);
    expect(text).toMatch(UNRESERVED);
    // Without wind the shorter version-2 form is still written (a smaller QR code).
    expect(text[0]).toBe('2');
    expect(decodeCheckPayload(text)).toEqual({ ok: true, value: payload });
  });

  it('round-trips the day’s wind at both aerodromes and the operator’s approach policy, and re-derives that card', () => {
    const windy: CardInputs = {
      ...jetInputs,
      departure: { ...jetInputs.departure, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } },
      arrival: { ...jetInputs.arrival!, runwayHeadingDeg: 45.5, wind: { directionDeg: 10, speedKt: 7 } },
      approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 },
    };
    const card = buildCard(jetRevision, windy, HAND_CONTEXT);
    const payload: CheckPayload = { revisionId: jetRevision.id, inputs: card.inputs, digest: card.digest };
    const decoded = decodeCheckPayload(encodeCheckPayload(payload));
    expect(decoded).toEqual({ ok: true, value: payload });
    if (decoded.ok) expect(buildCard(jetRevision, decoded.value.inputs, HAND_CONTEXT).digest).toBe(card.digest);
  });

  it('writes version 3 (28 fields) only for a card with wind or an approach policy', () => {
    const windy = encodeCheckPayload({ ...pistonPayload, inputs: { ...pistonPayload.inputs, departure: { ...pistonPayload.inputs.departure, runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: 5 } } } });
    expect(windy[0]).toBe('3');
    expect(windy.slice(45).split('_')).toHaveLength(28);
    expect(decodeCheckPayload('3' + encodeCheckPayload(pistonPayload).slice(1))).toMatchObject({ ok: false, message: expect.stringContaining('has 16 fields where a card has 28') });
  });

  it('still reads a version-1 payload (a card printed before issue 11), marked as made under earlier card rules', () => {
    const text = '1' + encodeCheckPayload(pistonPayload).slice(1);
    expect(decodeCheckPayload(text)).toEqual({ ok: true, value: { ...pistonPayload, earlierCardRules: true } });
    // Version 4 is the icing form (issue 16); 5 is a form no decoder reads yet.
    expect(decodeCheckPayload('5' + text.slice(1))).toMatchObject({ ok: false, message: expect.stringMatching(/in a form this version of Speedwright does not read/) });
  });

  it('re-derives the same card, to the digest, from the decoded inputs', () => {
    const decoded = decodeCheckPayload(encodeCheckPayload(jetPayload));
    if (!decoded.ok) throw new Error(decoded.message);
    expect(buildCard(jetRevision, decoded.value.inputs, HAND_CONTEXT).digest).toBe(jetCard.digest);
  });

  it('stays short enough for a small QR code (under 160 characters for these cards)', () => {
    expect(encodeCheckPayload(pistonPayload).length).toBeLessThan(160);
    expect(encodeCheckPayload(jetPayload).length).toBeLessThan(160);
  });

  it('round-trips any finite numbers the inputs schema accepts (property test, fast-check)', () => {
    const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 });
    const aerodrome = fc.record({ elevationFt: finite, qnhHpa: finite, oatC: finite, dewPointC: fc.option(finite, { nil: undefined }) }, { requiredKeys: ['elevationFt', 'qnhHpa', 'oatC'] });
    const inputs = fc.record(
      {
        airframeId: fc.integer({ min: 1, max: 4_294_967_295 }),
        weightKg: fc.double({ min: 1e-9, max: 999_999, noNaN: true }),
        landingWeightKg: fc.double({ min: 1e-9, max: 999_999, noNaN: true }),
        configuration: fc.constantFrom('clean', 'flap', 'landing-flap', 'f15-gear-down'),
        departure: aerodrome,
        arrival: aerodrome,
        isaDeviationC: finite,
        cruise: fc.oneof(fc.record({ iasKt: fc.double({ min: 1e-9, max: 999, noNaN: true }) }), fc.record({ mach: fc.double({ min: 1e-12, max: 0.999999, noNaN: true }) })),
        altitudeStepFt: fc.integer({ min: 100, max: 10_000 }),
      },
      { requiredKeys: ['airframeId', 'weightKg', 'configuration', 'departure', 'isaDeviationC', 'cruise', 'altitudeStepFt'] },
    );
    const digest = fc.uint8Array({ minLength: 32, maxLength: 32 }).map((bytes) => Buffer.from(bytes).toString('hex'));
    fc.assert(
      fc.property(inputs, digest, fc.integer({ min: 1, max: 4_294_967_295 }), (raw, hex, revisionId) => {
        const parsed = cardInputsSchema.parse(JSON.parse(JSON.stringify(raw)));
        const payload = { revisionId, inputs: parsed, digest: hex };
        const text = encodeCheckPayload(payload);
        expect(text).toMatch(UNRESERVED);
        expect(decodeCheckPayload(text)).toEqual({ ok: true, value: payload });
      }),
      { numRuns: 500 },
    );
  });

  it('covers every field of the card inputs (a new field needs a new payload version)', () => {
    expect(Object.keys(cardInputsSchema.shape).sort()).toEqual(
      ['airframeId', 'altitudeStepFt', 'approachAdditivePolicy', 'arrival', 'configuration', 'cruise', 'departure', 'icing', 'isaDeviationC', 'landingWeightKg', 'weightKg'],
    );
    expect(Object.keys(cardInputsSchema.shape.departure.shape).sort()).toEqual(['dewPointC', 'elevationFt', 'oatC', 'qnhHpa', 'runwayHeadingDeg', 'wind']);
  });
});

describe('the digest as base64url', () => {
  it('matches Node’s base64url (RFC 4648 §5) and reads back', () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 32, maxLength: 32 }), (bytes) => {
        const hex = Buffer.from(bytes).toString('hex');
        const text = digestToBase64Url(hex);
        expect(text).toBe(Buffer.from(bytes).toString('base64url'));
        expect(base64UrlToDigest(text)).toBe(hex);
      }),
    );
  });

  it('refuses a non-canonical last character and the wrong length', () => {
    const text = digestToBase64Url(pistonCard.digest);
    const last = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_'.indexOf(text[42]);
    expect(base64UrlToDigest(text.slice(0, 42) + 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_'[last | 1])).toBeUndefined();
    expect(base64UrlToDigest(text.slice(0, 42))).toBeUndefined();
  });
});

describe('a damaged payload is a sentence', () => {
  const good = encodeCheckPayload(pistonPayload);
  // Version, digest and the first '_' are 45 characters (the digest itself may hold '_').
  const head = good.slice(0, 45);
  const fields = good.slice(45).split('_');
  const withField = (at: number, value: string) => head + [...fields.slice(0, at), value, ...fields.slice(at + 1)].join('_');

  it.each([
    ['empty', '', 'carries no figures'],
    ['too long', good + 'x'.repeat(600), 'far longer'],
    ['odd characters', good.replace('_', '%'), 'characters no card code uses'],
    ['another version', `9${good.slice(1)}`, 'does not read'],
    ['a cut digest', good.slice(0, 30), 'digest is not readable'],
    ['a field missing', head + fields.slice(0, -1).join('_'), 'has 15 fields where a card has 16'],
    ['an unreadable number', withField(2, '9x0'), 'the takeoff weight is not readable'],
    ['two unreadable numbers', withField(2, '9x0').replace('_2000_', '_2e3.5_'), 'the takeoff weight, departure elevation are not readable'],
    ['an unknown cruise kind', withField(14, 'q100'), 'the cruise is not readable'],
    ['a revision that is not a record number', withField(0, '11.5'), 'the revision is not a record number'],
    ['a weight the schema refuses', withField(2, '-900'), 'incomplete: the takeoff weight in kg must be above zero (weightKg)'],
    ['a configuration the schema refuses', withField(4, 'FLAP'), '(configuration)'],
  ])('%s', (_what, text, sentence) => {
    const result = decodeCheckPayload(text);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.message).toContain(sentence);
      expect(result.message).toMatch(/^[A-Z].*\.$/);
    }
  });
});

describe('checkUrl and parseCheckUrl', () => {
  const code = generateCardCode();

  it('builds https://host/check/<code>?c=<payload> and reads it back', () => {
    const url = checkUrl('https://cards.kestrel-fen.example/', code, jetPayload);
    expect(url).toBe(`https://cards.kestrel-fen.example/check/${code}?c=${encodeCheckPayload(jetPayload)}`);
    expect(parseCheckUrl(url)).toEqual({
      ok: true,
      value: { origin: 'https://cards.kestrel-fen.example', code, printedCode: `${code.slice(0, 3)}-${code.slice(3, 6)}-${code.slice(6)}`, payload: jetPayload, payloadProblem: null, payloadText: encodeCheckPayload(jetPayload) },
    });
  });

  it('is the same URL the WHATWG URL parser sees (nothing to escape)', () => {
    const url = checkUrl('http://localhost:4300', code, pistonPayload);
    const parsed = new URL(url);
    expect(parsed.href).toBe(url);
    expect(parsed.searchParams.get('c')).toBe(encodeCheckPayload(pistonPayload));
  });

  it('refuses an origin that is not http(s)://host[:port] and a code that is not valid', () => {
    expect(() => checkUrl('ftp://x.example', code, pistonPayload)).toThrow('not an http(s) origin');
    expect(() => checkUrl('https://x.example/app', code, pistonPayload)).toThrow('not an http(s) origin');
    expect(() => checkUrl('https://x.example', 'K7M4RTX9A', pistonPayload)).toThrow('does not fit');
  });

  it('reads a path, a percent-encoded payload, a printed code and a bare typed code', () => {
    const payload = encodeCheckPayload(pistonPayload);
    expect(parseCheckUrl(`/check/${code}?c=${payload}`)).toMatchObject({ ok: true, value: { origin: null, code, payload: pistonPayload, payloadText: payload } });
    expect(parseCheckUrl(`https://a.example/check/${code}?x=1&c=${encodeURIComponent(payload).replace(/\./g, '%2E')}#top`)).toMatchObject({ ok: true, value: { payload: pistonPayload } });
    expect(parseCheckUrl(`https://a.example/check/${code.toLowerCase().slice(0, 3)}-${code.slice(3).toLowerCase()}`)).toMatchObject({ ok: true, value: { code, payload: null, payloadProblem: null } });
    expect(parseCheckUrl(` ${code.toLowerCase()} `)).toMatchObject({ ok: true, value: { origin: null, code, payload: null, payloadText: null } });
  });

  it('keeps the code when the payload is damaged, and says what is wrong', () => {
    expect(parseCheckUrl(`https://a.example/check/${code}?c=1abc`)).toMatchObject({
      ok: true,
      value: { code, payload: null, payloadProblem: expect.stringContaining('digest is not readable'), payloadText: '1abc' },
    });
    expect(parseCheckUrl(`https://a.example/check/${code}?c=%E0%A4%A`)).toMatchObject({ ok: true, value: { payloadProblem: expect.stringContaining('characters no card code uses') } });
  });

  it('fails with a sentence for other addresses and bad codes', () => {
    expect(parseCheckUrl('https://a.example/cards/123')).toEqual({ ok: false, message: expect.stringContaining('not a Speedwright card check address') });
    expect(parseCheckUrl('mailto:someone@example.com')).toMatchObject({ ok: false });
    expect(parseCheckUrl('https://a.example/check/K7M4RTX9A')).toEqual({ ok: false, message: expect.stringContaining('does not fit') });
    expect(parseCheckUrl('https://a.example/check/%E0%A4%A')).toEqual({ ok: false, message: 'The card code in this address is damaged.' });
    expect(parseCheckUrl('')).toEqual({ ok: false, message: 'Type the code printed on the card.' });
  });
});

describe('the compact payload with icing conditions (issue 16)', () => {
  it('writes version 4 only for a card with icing ticked and reads it back to the same inputs', () => {
    const revision = revisionOf(demoTwinTurbopropContent());
    const inputs: CardInputs = {
      airframeId: HAND_CONTEXT.airframe.id, weightKg: 4600, configuration: 'takeoff-flap',
      departure: { elevationFt: 0, qnhHpa: 1013.25, oatC: 15 }, isaDeviationC: 0, cruise: { iasKt: 200 }, altitudeStepFt: 5000,
    };
    const plain = buildCard(revision, inputs, HAND_CONTEXT);
    const iced = buildCard(revision, { ...inputs, icing: true }, HAND_CONTEXT);
    const plainText = encodeCheckPayload({ revisionId: revision.id, inputs: plain.inputs, digest: plain.digest });
    const icedText = encodeCheckPayload({ revisionId: revision.id, inputs: iced.inputs, digest: iced.digest });
    expect(plainText[0]).toBe('2');
    expect(icedText[0]).toBe('4');
    expect(icedText.endsWith('_1')).toBe(true);
    const decoded = decodeCheckPayload(icedText);
    if (!decoded.ok) throw new Error(decoded.message);
    expect(decoded.value.inputs.icing).toBe(true);
    expect(buildCard(revision, decoded.value.inputs, HAND_CONTEXT).digest).toBe(iced.digest);
    expect(decodeCheckPayload(icedText.slice(0, -1) + '2')).toMatchObject({ ok: false, message: expect.stringMatching(/icing is not readable/) });
  });
});
