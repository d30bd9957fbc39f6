/**
 * A card with icing conditions ticked (and the day's wind) keeps to the pages of the same card
 * without icing, for every demo book and every single-card paper (half letter, A5): the iced
 * figures sit inside their speeds' lines, the notes on the back. Rendered in Node
 * (`renderCardPdf`) and read back with pdf-parse. Invented demo data — not for flight.
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
  ['turboprop', demoTwinTurbopropContent(), { weightKg: 5000, landingWeightKg: 4600, cruise: { iasKt: 200 } }],
  ['jet', demoLightTwinJetContent(), { weightKg: 4000, cruise: { mach: 0.6 } }],
] as const;

/** Gusty crosswinds at both ends, with the common practice as the operator's policy. */
const windyInputs = (extra: (typeof BOOKS)[number][2]): CardInputs => ({
  airframeId: 1,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 500, qnhHpa: 1008, oatC: 22, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } },
  arrival: { elevationFt: 800, qnhHpa: 1010, oatC: 18, runwayHeadingDeg: 90, wind: { directionDeg: 140, speedKt: 18, gustKt: 28 } },
  approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 },
  isaDeviationC: 5,
  altitudeStepFt: 2000,
  ...extra,
});

async function pagesOf(content: unknown, inputs: CardInputs, paper: 'half-letter' | 'a5'): Promise<{ pages: number; text: string }> {
  const card = buildCard(
    { id: 1, number: 2, publishedAt: '2026-12-05T00:00:00.000Z', contentSha256: contentSha256(content), content },
    inputs,
    { airframe: { id: 1, registration: 'ZZ-KFA' }, aircraftType: { designator: 'ZZP1', name: 'Demo type' }, speedBook: { id: 1, title: 'Demo book' }, demo: true },
  );
  // A check URL as long as an iced windy card's (version 4 payload, about 200 characters).
  const { definition } = cardPdf({ card, code: 'K7M-4RT-X9X', checkUrl: `https://cards.example/check/K7M4RTX9X?c=4${'A'.repeat(202)}`, issuedAt: '2026-12-05T22:00:00.000Z', dataAsOf: 'Data as of 5 Dec 2026.', changes: NO_CHANGES, paper });
  const reading = await readPdf(await renderCardPdf(definition));
  return { pages: reading.pages, text: reading.text.replace(/\s+/g, ' ') };
}

describe('the printed card with icing conditions', () => {
  it.each(BOOKS.flatMap(([name, content, extra]) => (['half-letter', 'a5'] as const).map((paper) => [name, paper, content, extra] as const)))(
    '%s on %s paper has as many pages with icing as without',
    async (name, paper, content, extra) => {
      const plain = await pagesOf(content, windyInputs(extra), paper);
      const iced = await pagesOf(content, { ...windyInputs(extra), icing: true }, paper);
      expect(iced.pages).toBe(plain.pages);
      expect(iced.text).toContain('Icing conditions:');
      // Turboprop VREF at 4,600 kg is the table's 97 kt (invented demo data), +10 kt ice → 107 kt.
      expect(iced.text.includes('ICED » 107 KIAS = VREF + 10 ice')).toBe(name === 'turboprop');
      // The trainer and the jet state no increment: each configuration is named, nothing guessed.
      expect(iced.text.includes('No ice increment stated for')).toBe(true);
      expect(iced.text).not.toMatch(/NaN|undefined|Infinity/);
    },
  );
});
