/**
 * The card both halves of pdf.bench.ts print: the demo light twin-jet with a 25-row altitude
 * table (as card.bench.ts), revision marks against an earlier revision with a lower VMO, a card
 * code and check URL. Invented demo data — not for flight.
 */
import { checkUrl } from '@shared/card-check/check-url';
import { formatCardCode } from '@shared/card-check/card-code';
import type { SpeedCard } from '@shared/card/card';
import { cardChanges, previousCardOf, type CardChanges } from '@shared/card-pdf/revision-marks';
import type { CardPdfInput } from '@shared/card-pdf/card-document';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoLightTwinJetContent } from '@shared/speed-book/demo-content';

const content = demoLightTwinJetContent();
const earlier = demoLightTwinJetContent();
earlier.limits.vmoKt = (earlier.limits.vmoKt ?? 280) - 10;

const revision = { id: 2, number: 2, publishedAt: '2026-12-01T08:00:00.000Z', contentSha256: contentSha256(content), content };
const previous = { id: 1, number: 1, publishedAt: '2026-11-01T08:00:00.000Z', contentSha256: contentSha256(earlier), content: earlier };
const context = { airframe: { id: 1, registration: 'ZZ-KFJ' }, aircraftType: { designator: 'ZZJ2', name: 'Heronbolt J2' }, speedBook: { id: 1, title: 'Heronbolt J2 speed book' }, demo: true };
const inputs = {
  airframeId: 1,
  weightKg: 4500,
  landingWeightKg: 4100,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 1200, qnhHpa: 1009, oatC: 24, dewPointC: 14 },
  arrival: { elevationFt: 300, qnhHpa: 1016, oatC: 18 },
  isaDeviationC: 8,
  cruise: { mach: 0.68 },
  altitudeStepFt: 1750,
};
const CODE = 'K7M4RTX9X';

export const BENCH_CARD = {
  revision,
  inputs,
  context,
  changes: (card: SpeedCard): CardChanges => cardChanges(card, previousCardOf(previous, inputs, context)),
  print: {
    code: formatCardCode(CODE),
    checkUrl: checkUrl('https://ops.speedwright.example', CODE, { revisionId: revision.id, inputs, digest: '0'.repeat(64) }),
    issuedAt: '2026-12-02T01:30:00.000Z',
    dataAsOf: 'Data as of 2 Dec 2026, 01:30 UTC: revision 2 of Heronbolt J2 speed book.',
    paper: 'half-letter',
  } satisfies Omit<CardPdfInput, 'card' | 'changes'>,
};
