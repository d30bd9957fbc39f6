/**
 * Determinism of the card and its digest: the same inputs give the same digest, the digest
 * survives the JSON round trip the card log's report makes, and no valid input yields NaN or
 * Infinity anywhere in a card (a property test with fast-check over the demo types).
 */
import fc from 'fast-check';
import { isaTemperatureC } from '../aero';
import { canonicalJson, sha256Hex } from '../speed-book/canonical';
import { demoLightTwinJetContent, demoPistonTrainerContent, demoPistonTrainerContentRevised, demoTwinTurbopropContent } from '../speed-book/demo-content';
import type { RevisionContent } from '../speed-book/revision-content';
import { buildCard, takeoffConfigurationKeys } from './build-card';
import { CardRefusedError, type CardInputs, type SpeedCard } from './card';
import { canonicalCardJson, cardDigest } from './card-digest';
import { HAND_PISTON_CARD_DIGEST, handPistonContent, handPistonInputs, HAND_CONTEXT, revisionOf } from './testing/test-fixtures';

describe('cardDigest', () => {
  it('is the SHA-256 of the canonical JSON of the card without its digest', () => {
    const card = buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT);
    const { digest, ...body } = card;
    // RFC 8785 canonical JSON, then SHA-256 (FIPS 180-4) in lower-case hex.
    expect(digest).toBe(sha256Hex(canonicalJson(body)));
    expect(cardDigest(card)).toBe(digest);
    expect(cardDigest(body)).toBe(digest);
    expect(digest).toMatch(/^[0-9a-f]{64}$/);
  });

  it('is the same for the same inputs, after a JSON round trip, and in any key order', () => {
    const first = buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT);
    const again = buildCard(revisionOf(handPistonContent()), JSON.parse(JSON.stringify(handPistonInputs())) as CardInputs, HAND_CONTEXT);
    const { cruise, altitudeStepFt, ...rest } = handPistonInputs();
    const reordered = buildCard(revisionOf(handPistonContent()), { altitudeStepFt, cruise, ...rest }, HAND_CONTEXT);
    expect(again.digest).toBe(first.digest);
    expect(reordered.digest).toBe(first.digest);
    expect(cardDigest(JSON.parse(JSON.stringify(first)) as SpeedCard)).toBe(first.digest);
  });

  it('covers the day’s wind and the operator’s policy: either changes the digest, a JSON round trip does not', () => {
    const windy = (gustKt: number, maximumKt: number): CardInputs => ({
      ...handPistonInputs(),
      departure: { ...handPistonInputs().departure, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt } },
      approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt },
    });
    const card = buildCard(revisionOf(handPistonContent()), windy(30, 20), HAND_CONTEXT);
    const { digest, ...body } = card;
    // RFC 8785 canonical JSON, then SHA-256 (FIPS 180-4): the wind keys are in key order like the rest.
    expect(digest).toBe(sha256Hex(canonicalJson(body)));
    expect(canonicalCardJson(body)).toBe(canonicalJson(body));
    expect(cardDigest(JSON.parse(JSON.stringify(card)) as SpeedCard)).toBe(digest);
    expect(buildCard(revisionOf(handPistonContent()), JSON.parse(JSON.stringify(windy(30, 20))) as CardInputs, HAND_CONTEXT).digest).toBe(digest);
    expect(buildCard(revisionOf(handPistonContent()), windy(31, 20), HAND_CONTEXT).digest).not.toBe(digest);
    expect(buildCard(revisionOf(handPistonContent()), windy(30, 19), HAND_CONTEXT).digest).not.toBe(digest);
    // Without wind the card is exactly as before the wind existed (its pinned digest).
    expect(buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT).digest).toBe(HAND_PISTON_CARD_DIGEST);
  });

  it('writes the same canonical JSON as the RFC 8785 library, in order or not', () => {
    const card = buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT);
    const { digest: _digest, ...body } = card;
    expect(canonicalCardJson(body)).toBe(canonicalJson(body));
    expect(canonicalCardJson(card)).toBe(canonicalJson(card)); // digest first: out of order
    const awkward = { b: [1, { z: 1, a: undefined, '10': 'x', '9': -0 }], a: 'é\u2028"', c: 1e21, d: 0.1 + 0.2 };
    expect(canonicalCardJson(awkward)).toBe(canonicalJson(awkward));
    expect(() => canonicalCardJson({ a: Number.NaN })).toThrow('NaN has no JSON form');
  });

  it('uses the content checked when it was first seen; a changed hash or a new object is checked again', () => {
    const revision = revisionOf(handPistonContent());
    const first = buildCard(revision, handPistonInputs(), HAND_CONTEXT);
    // Changing the caller's object afterwards cannot reach a card: the checked copy is used.
    (revision.content as ReturnType<typeof handPistonContent>).limits.vneKt = 140;
    expect(buildCard(revision, handPistonInputs(), HAND_CONTEXT).digest).toBe(first.digest);
    expect(() => buildCard({ ...revision, contentSha256: '0'.repeat(64) }, handPistonInputs(), HAND_CONTEXT)).toThrow('does not match its published hash');
    expect(() => buildCard({ ...revision, content: structuredClone(revision.content) }, handPistonInputs(), HAND_CONTEXT)).toThrow('does not match its published hash');
  });

  it('changes with any input and with the revision', () => {
    const base = buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT).digest;
    const heavier = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), weightKg: 901 }, HAND_CONTEXT).digest;
    const otherRevision = buildCard(revisionOf(handPistonContent(), 12, 4), handPistonInputs(), HAND_CONTEXT).digest;
    expect(new Set([base, heavier, otherRevision]).size).toBe(3);
  });

  it('is pinned for the hand-worked card (the Chromium test checks the same value)', () => {
    expect(buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT).digest).toBe(HAND_PISTON_CARD_DIGEST);
  });
});

/** Every number anywhere in `value`, with its path. */
function numbersOf(value: unknown, path = '$', into: [string, number][] = []): [string, number][] {
  if (typeof value === 'number') into.push([path, value]);
  else if (Array.isArray(value)) value.forEach((item, i) => numbersOf(item, `${path}[${i}]`, into));
  else if (value && typeof value === 'object') for (const [key, item] of Object.entries(value)) numbersOf(item, `${path}.${key}`, into);
  return into;
}

const DEMO: { name: string; content: RevisionContent }[] = [
  { name: 'trainer', content: demoPistonTrainerContent() },
  { name: 'trainer rev 2', content: demoPistonTrainerContentRevised() },
  { name: 'turboprop', content: demoTwinTurbopropContent() },
  { name: 'jet', content: demoLightTwinJetContent() },
];

/** Inputs spread over and beyond each demo type's data, so both cards and refusals come out. */
function inputsFor(content: RevisionContent): fc.Arbitrary<CardInputs> {
  const { minimumKg, maximumTakeoffKg, maximumLandingKg } = content.weights;
  const cruiseTable = content.configurations[0].positionError;
  const aerodrome = fc
    .record({
      elevationFt: fc.double({ min: -500, max: 8000, noNaN: true }),
      qnhHpa: fc.double({ min: 940, max: 1060, noNaN: true }),
      isaOffsetC: fc.double({ min: -30, max: 25, noNaN: true }),
      spreadC: fc.option(fc.double({ min: 0, max: 30, noNaN: true }), { nil: undefined }),
    })
    .map(({ elevationFt, qnhHpa, isaOffsetC, spreadC }) => {
      const oatC = isaTemperatureC(Math.max(0, elevationFt)) + isaOffsetC;
      return spreadC === undefined ? { elevationFt, qnhHpa, oatC } : { elevationFt, qnhHpa, oatC, dewPointC: oatC - spreadC };
    });
  return fc.record({
    airframeId: fc.constant(HAND_CONTEXT.airframe.id),
    weightKg: fc.double({ min: minimumKg * 0.98, max: maximumTakeoffKg * 1.01, noNaN: true }),
    landingFraction: fc.option(fc.double({ min: 0.8, max: 1, noNaN: true }), { nil: undefined }),
    configuration: fc.constantFrom(...takeoffConfigurationKeys(content)),
    departure: aerodrome,
    arrival: fc.option(aerodrome, { nil: undefined }),
    isaDeviationC: fc.double({ min: -30, max: 35, noNaN: true }),
    cruise: fc.oneof(
      fc.record({ iasKt: fc.double({ min: cruiseTable[0].iasKt, max: cruiseTable[cruiseTable.length - 1].iasKt, noNaN: true }) }),
      fc.record({ mach: fc.double({ min: 0.2, max: 0.85, noNaN: true }) }),
    ),
    altitudeStepFt: fc.integer({ min: 500, max: 6000 }),
  }).map(({ landingFraction, ...inputs }) => {
    // Landing weights from 80 % of the takeoff weight up to it: some above the maximum landing weight.
    const landingWeightKg = landingFraction === undefined ? undefined : Math.min(inputs.weightKg * landingFraction, maximumLandingKg * 1.01);
    return (landingWeightKg === undefined ? inputs : { ...inputs, landingWeightKg }) as CardInputs;
  });
}

describe('no NaN, ever (property test, fast-check)', () => {
  for (const { name, content } of DEMO) {
    it(`the ${name}: every random input gives a card of finite figures or a refusal with a sentence`, () => {
      const revision = revisionOf(content);
      let cards = 0;
      let refusals = 0;
      fc.assert(
        fc.property(inputsFor(content), (inputs) => {
          let card: SpeedCard;
          try {
            card = buildCard(revision, inputs, HAND_CONTEXT);
          } catch (error) {
            if (!(error instanceof CardRefusedError)) throw error;
            expect(error.message.length).toBeGreaterThan(10);
            expect(error.field).not.toBe('');
            refusals++;
            return;
          }
          cards++;
          for (const [path, value] of numbersOf(card)) if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
          expect(cardDigest(card)).toBe(card.digest);
          expect(buildCard(revision, JSON.parse(JSON.stringify(inputs)) as CardInputs, HAND_CONTEXT).digest).toBe(card.digest);
        }),
        { numRuns: 200, seed: 20261201 },
      );
      // The arbitraries must exercise both sides, or the property says little.
      expect(cards).toBeGreaterThan(30);
      expect(refusals).toBeGreaterThan(10);
    });
  }
});
