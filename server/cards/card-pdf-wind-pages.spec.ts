/**
 * A card with the day's wind keeps to the pages of the same card without it, for every demo
 * book and every single-card paper (half letter, A5): the wind, the approach speed and the
 * operator's policy fit into room the card already had. Rendered in Node (`renderCardPdf`) and
 * read back with pdf-parse. Invented demo data — not for flight.
 */
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { cardPdf } from '@shared/card-pdf/card-document';
import { NO_CHANGES } from '@shared/card-pdf/revision-marks';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoLightTwinJetContent, demoPistonTrainerContentRevised, demoTwinTurbopropContent } from '@shared/speed-book/demo-content';
import { readPdf } from '../../test/api/read-pdf';
import { renderCardPdf } from './card-pdf-renderer';

jest.setTimeout(120_000);

const BOOKS = [
  ['trainer', demoPistonTrainerContentRevised(), { weightKg: 1050, landingWeightKg: 1000, cruise: { iasKt: 105 } }],
  ['turboprop', demoTwinTurbopropContent(), { weightKg: 5000, cruise: { iasKt: 200 } }],
  ['jet', demoLightTwinJetContent(), { weightKg: 4000, cruise: { mach: 0.6 } }],
] as const;

const calmInputs = (extra: (typeof BOOKS)[number][2]): CardInputs => ({
  airframeId: 1,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 500, qnhHpa: 1008, oatC: 22 },
  arrival: { elevationFt: 800, qnhHpa: 1010, oatC: 18 },
  isaDeviationC: 5,
  altitudeStepFt: 2000,
  ...extra,
});

/** Gusty crosswinds at both ends, with the common practice as the operator's policy. */
const windyInputs = (extra: (typeof BOOKS)[number][2]): CardInputs => {
  const calm = calmInputs(extra);
  return {
    ...calm,
    departure: { ...calm.departure, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } },
    arrival: { ...calm.arrival!, runwayHeadingDeg: 90, wind: { directionDeg: 140, speedKt: 18, gustKt: 28 } },
    approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 },
  };
};

async function pagesOf(content: unknown, inputs: CardInputs, paper: 'half-letter' | 'a5'): Promise<{ pages: number; text: string }> {
  const card = buildCard(
    { id: 1, number: 2, publishedAt: '2026-12-05T00:00:00.000Z', contentSha256: contentSha256(content), content },
    inputs,
    { airframe: { id: 1, registration: 'ZZ-KFA' }, aircraftType: { designator: 'ZZP1', name: 'Demo type' }, speedBook: { id: 1, title: 'Demo book' }, demo: true },
  );
  // A check URL as long as a windy card's (version 3 payload, about 200 characters).
  const { definition } = cardPdf({ card, code: 'K7M-4RT-X9X', checkUrl: `https://cards.example/check/K7M4RTX9X?c=3${'A'.repeat(200)}`, issuedAt: '2026-12-05T22:00:00.000Z', dataAsOf: 'Data as of 5 Dec 2026.', changes: NO_CHANGES, paper });
  const reading = await readPdf(await renderCardPdf(definition));
  return { pages: reading.pages, text: reading.text.replace(/\s+/g, ' ') };
}

describe('the printed card with wind', () => {
  it.each(BOOKS.flatMap(([name, content, extra]) => (['half-letter', 'a5'] as const).map((paper) => [name, paper, content, extra] as const)))(
    '%s on %s paper has as many pages with wind as without',
    async (name, paper, content, extra) => {
      const calm = await pagesOf(content, calmInputs(extra), paper);
      const windy = await pagesOf(content, windyInputs(extra), paper);
      expect(windy.pages).toBe(calm.pages);
      expect(windy.text).toContain('Approach: VREF +');
      expect(windy.text).toContain('Arrival wind rwy 090°M · 140°M 18G28 kt');
      // runway 090, wind 140/18G28: in the gusts 28·sin 50° = 21.4 kt across, above the trainer's demonstrated 15 kt (the twins state 24 and 25 kt).
      expect(windy.text.includes('CAUTION overleaf')).toBe(name === 'trainer');
      expect(/Arrival: The crosswind \(in the gusts 21 kt\) exceeds the 15 kt crosswind the flight manual states as demonstrated\./.test(windy.text)).toBe(name === 'trainer');
      expect(windy.text).not.toMatch(/NaN|undefined|Infinity/);
    },
  );
});
