import jsQR from 'jsqr';
import { buildCard } from '../card/build-card';
import { SAFETY_CAUTION } from '../card/card-presentation';
import { HAND_CONTEXT, handJetContent, handPistonContent, handPistonInputs, revisionOf } from '../card/testing/test-fixtures';
import { cardPdf, type CardPdfInput } from './card-document';
import { cardPdfFileName } from './file-name';
import { CARD_PAPERS, CARD_PAPER_SIZES } from './page-sizes';
import { qrVector } from './qr';
import { NO_CHANGES, cardChanges, lineKey, previousCardOf } from './revision-marks';
import { furnitureOf, markedRows, plainText, tablesOf, textsOf } from './testing/test-helpers';

// Invented test data — not for flight.

const card = buildCard(revisionOf(handPistonContent(), 12, 4), handPistonInputs(), HAND_CONTEXT);
const base: CardPdfInput = {
  card,
  code: 'K7QM-2XRT-9',
  checkUrl: 'https://ops.example/check/K7QM2XRT9?r=12&d=4cc69e6b',
  issuedAt: '2026-12-02T01:30:00.000Z',
  dataAsOf: 'Data as of 2 Dec 2026, 01:30 UTC.',
  changes: NO_CHANGES,
  paper: 'half-letter',
};

function allText(input: CardPdfInput): string[] {
  const { definition } = cardPdf(input);
  return [...textsOf(definition.content), ...textsOf(furnitureOf(definition, 1, 2)), ...textsOf(furnitureOf(definition, 2, 2))];
}

describe('card document definition', () => {
  it('sizes the sheet for each paper (1 in = 72 pt; A5 148 × 210 mm and A4 210 × 297 mm, ISO 216)', () => {
    const size = (paper: CardPdfInput['paper']) => cardPdf({ ...base, paper }).definition.pageSize as { width: number; height: number };
    expect(size('half-letter')).toEqual({ width: 396, height: 612 });
    expect(size('a5').width).toBeCloseTo(419.53, 2);
    expect(size('a5').height).toBeCloseTo(595.28, 2);
    // Two-up: landscape letter (11 × 8.5 in) and landscape A4, two card boxes side by side.
    expect(size('two-up-letter')).toEqual({ width: 792, height: 612 });
    expect(size('two-up-a4').width).toBeCloseTo(841.89, 2);
    expect(size('two-up-a4').height).toBeCloseTo(595.28, 2);
    for (const paper of CARD_PAPER_SIZES) expect(CARD_PAPERS[paper].sheet.width).toBeCloseTo(CARD_PAPERS[paper].box.width * CARD_PAPERS[paper].copies, 6);
  });

  it('prints two copies of each page on a two-up sheet, one on a kneeboard sheet', () => {
    const one = cardPdf(base).definition.content as unknown[];
    const two = cardPdf({ ...base, paper: 'two-up-a4' }).definition.content as { columns?: unknown[]; stack?: { columns?: unknown[] }[] }[];
    expect(one).toHaveLength(2);
    expect([two[0].columns?.length, two[1].stack?.[0].columns?.length]).toEqual([2, 2]);
    expect(JSON.stringify(two[0].columns![0])).toEqual(JSON.stringify(two[0].columns![1]));
    expect((cardPdf(base).definition.content as { pageBreak?: string }[])[1].pageBreak).toBe('before');
  });

  it('carries the registration, type, revision, code, every speed and limit, and the caution on every page', () => {
    const texts = allText(base);
    const joined = texts.join('\n');
    expect(joined).toContain('ZZ-TST');
    expect(joined).toContain('ZZH1');
    expect(joined).toContain('revision 4');
    expect(joined).toContain('K7QM-2XRT-9');
    for (const speed of card.speeds) {
      expect(texts).toContain(speed.code);
      expect(texts).toContain(String(speed.iasKt));
      expect(texts).toContain(String(speed.casKt));
    }
    expect(texts).toContain(String(card.limits.vne!.iasKt));
    for (const row of card.altitudeTable) expect(texts).toContain(row.pressureAltitudeFt.toLocaleString('en-US'));
    for (const page of [1, 2]) expect(textsOf(furnitureOf(cardPdf(base).definition, page, 2)).join(' ')).toContain(SAFETY_CAUTION);
    expect(SAFETY_CAUTION).toContain("The approved flight manual and the operator's procedures govern.");
  });

  it('says "invented demo data — not for flight" on a demo card only', () => {
    expect(allText(base).join(' ')).toContain('INVENTED DEMO DATA — NOT FOR FLIGHT');
    expect(allText(base).join(' ')).toContain('invented demo data — not for flight.');
    const real = buildCard(revisionOf(handPistonContent(), 12, 4), handPistonInputs(), { ...HAND_CONTEXT, demo: false });
    expect(allText({ ...base, card: real }).join(' ').toLowerCase()).not.toContain('demo');
  });

  it('prints no NaN, undefined, null or Infinity anywhere, also on a card with figures the data cannot give', () => {
    // The jet at Mach 0.8 low down: IAS of the cruise outside the position-error table prints "–".
    const jetInputs = { airframeId: 7, weightKg: 7000, configuration: 'flap', departure: { elevationFt: 0, qnhHpa: 1013.25, oatC: 15 }, isaDeviationC: 0, cruise: { mach: 0.78 }, altitudeStepFt: 5000 };
    const jet = buildCard(revisionOf(handJetContent(), 21, 1), jetInputs, HAND_CONTEXT);
    expect(jet.altitudeTable.some((row) => row.iasKt === null)).toBe(true);
    for (const input of [base, { ...base, card: jet, paper: 'two-up-letter' as const }]) {
      const texts = allText(input);
      expect(texts.length).toBeGreaterThan(100);
      for (const text of texts) expect(text).not.toMatch(/NaN|undefined|null|Infinity|\[object/);
    }
    expect(allText({ ...base, card: jet })).toContain('–');
  });

  it('puts a revision bar beside exactly the lines that changed, and explains it', () => {
    const before = handPistonContent();
    before.limits.vneKt = 130;
    const changes = cardChanges(card, previousCardOf(revisionOf(before, 11, 3), handPistonInputs(), HAND_CONTEXT));
    expect(changes.changed.has(lineKey.limit('VNE'))).toBe(true);
    const { definition } = cardPdf({ ...base, changes });
    const rows = markedRows(definition.content);
    // VNE's limit row, its indicator legend line and yellow arc, and every altitude row (VNE is their limit).
    expect(rows.filter((row) => row.startsWith('VNE'))).toHaveLength(1);
    expect(rows.some((row) => row.includes('Red line — VNE'))).toBe(true);
    expect(rows.some((row) => row.includes('Yellow arc'))).toBe(true);
    expect(rows).toHaveLength(3 + card.altitudeTable.length);
    expect(rows.some((row) => row.startsWith('VR'))).toBe(false);
    expect(textsOf(furnitureOf(definition)).join(' ')).toContain('differs from revision 3 for the same inputs');

    const plain = cardPdf(base).definition;
    expect(markedRows(plain.content)).toEqual([]);
    expect(textsOf(furnitureOf(plain)).join(' ')).toContain("Revision 4 is the speed book's first published revision: no revision marks.");
  });

  it('says when the previous revision is not at hand instead of printing no marks silently', () => {
    const { definition } = cardPdf({ ...base, changes: { againstRevision: 3, compared: false, changed: new Set(), removed: [] } });
    expect(textsOf(furnitureOf(definition)).join(' ')).toContain('Revision marks not shown: revision 3 is not on this device');
  });

  it('draws the indicator from the shared dial drawing, every marking named in the legend', () => {
    const { definition } = cardPdf(base);
    const svg = textsOf(definition.content).find((text) => text.startsWith('<svg') && text.includes('KIAS'))!;
    expect(svg).toBeDefined();
    // One outlined white band (two paths), one green, one striped yellow (two paths): 5 arc paths.
    expect(svg.match(/<path /g)).toHaveLength(5);
    expect(svg).toContain('>VNE</text>');
    const legend = tablesOf(definition.content).flatMap((table) => table.body).map((row) => row.map(plainText).join(' '));
    expect(legend.some((row) => row.includes('Green arc — normal operating range, VS1 to VNO: ' + card.indicator.arcs.find((a) => a.colour === 'green')!.fromKt))).toBe(true);
  });

  it('names the file <registration>-rev<N>-<yyyy-mm-dd>.pdf, safe on any file system', () => {
    expect(cardPdf(base).fileName).toBe('ZZ-TST-rev4-2026-12-02.pdf');
    expect(cardPdfFileName('zz/ab c..', 12, '2026-01-05T23:59:00Z')).toBe('ZZ-AB-C-rev12-2026-01-05.pdf');
    expect(cardPdfFileName('../', 1, 'not a date')).toBe('card-rev1-undated.pdf');
  });
});

describe('QR code of the check URL', () => {
  it('decodes back to the URL (jsQR, a reference decoder) from its vector squares', () => {
    const url = 'https://ops.example/check/K7QM2XRT9?r=12&i=eyJhIjo3LCJ3Ijo5MDB9&d=4cc69e6bb6b1e1a3';
    const size = 300;
    const { canvas, modules, rects } = qrVector(url, size);
    expect(canvas).toHaveLength(rects.length);
    expect(modules).toBeGreaterThanOrEqual(21);
    // Paint the rectangles onto white RGBA pixels, one pixel per point.
    const pixels = new Uint8ClampedArray(size * size * 4).fill(255);
    for (const rect of rects) {
      for (let y = Math.round(rect.y); y < Math.round(rect.y + rect.h); y++) {
        for (let x = Math.round(rect.x); x < Math.round(rect.x + rect.w); x++) {
          const at = (y * size + x) * 4;
          pixels[at] = pixels[at + 1] = pixels[at + 2] = 0;
        }
      }
    }
    expect(jsQR(pixels, size, size)?.data).toBe(url);
  });
});

describe('a card issued offline, before the server gave it a code', () => {
  it('says it has no check code yet and why, with no QR code', () => {
    const { definition } = cardPdf({ ...base, code: null, checkUrl: null });
    const texts = allText({ ...base, code: null, checkUrl: null }).join(' ');
    expect(texts).toContain('NO CODE YET');
    expect(texts).toContain('NOT YET CHECKABLE');
    expect(texts).toContain('Issued offline: the card log gives this card its check code when the device next reaches the server.');
    expect(texts).not.toMatch(/null|undefined/);
    // A QR code is a canvas of hundreds of squares; the legend swatches have a few.
    const qrCodes = (content: unknown) => (JSON.stringify(content).match(/"canvas":\[[^\]]*\]/g) ?? []).filter((canvas) => (canvas.match(/"type":"rect"/g) ?? []).length > 50);
    expect(qrCodes(definition.content)).toEqual([]);
    expect(qrCodes(cardPdf(base).definition.content)).toHaveLength(1);
  });
});
