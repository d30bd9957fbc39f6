/**
 * Paper the card prints on. A card is one kneeboard page box (half-letter or A5); the two-up
 * sheets carry two copies of each page side by side on landscape letter or A4, to be cut apart:
 * 5.5 × 8.5 in is exactly half of letter; half of A4 is 148.5 × 210 mm (A5 is 148 mm wide, so
 * a half sheet is half a millimetre wider than A5).
 */
export const CARD_PAPER_SIZES = ['half-letter', 'a5', 'two-up-letter', 'two-up-a4'] as const;
export type CardPaperSize = (typeof CARD_PAPER_SIZES)[number];

const PT_PER_INCH = 72;
const PT_PER_MM = 72 / 25.4;

/** One card box, pt (portrait). */
export interface CardBox {
  readonly width: number;
  readonly height: number;
}

const HALF_LETTER: CardBox = { width: 5.5 * PT_PER_INCH, height: 8.5 * PT_PER_INCH };
const A5: CardBox = { width: 148 * PT_PER_MM, height: 210 * PT_PER_MM };
const A4_LANDSCAPE: CardBox = { width: 297 * PT_PER_MM, height: 210 * PT_PER_MM };
const HALF_A4: CardBox = { width: A4_LANDSCAPE.width / 2, height: A4_LANDSCAPE.height };

export interface CardPaper {
  readonly size: CardPaperSize;
  /** Words for the size chooser. */
  readonly label: string;
  /** The sheet, pt, as pdfmake takes it (width × height, already in its orientation). */
  readonly sheet: CardBox;
  /** The card box on the sheet. */
  readonly box: CardBox;
  /** Copies of the card side by side on a sheet. */
  readonly copies: 1 | 2;
  /** How to print it, as the end of a sentence ("print it …"). */
  readonly howToPrint: string;
}

export const CARD_PAPERS: Readonly<Record<CardPaperSize, CardPaper>> = {
  'half-letter': { size: 'half-letter', label: 'Half letter (5.5 × 8.5 in)', sheet: HALF_LETTER, box: HALF_LETTER, copies: 1, howToPrint: 'at actual size on 5.5 × 8.5 in paper, double-sided' },
  a5: { size: 'a5', label: 'A5 (148 × 210 mm)', sheet: A5, box: A5, copies: 1, howToPrint: 'at actual size on A5 paper, double-sided' },
  'two-up-letter': {
    size: 'two-up-letter',
    label: 'Letter, two cards to cut',
    sheet: { width: 2 * HALF_LETTER.width, height: HALF_LETTER.height },
    box: HALF_LETTER,
    copies: 2,
    howToPrint: 'at actual size on letter paper, landscape, double-sided (flip on the short edge), and cut along the dashed line',
  },
  'two-up-a4': {
    size: 'two-up-a4',
    label: 'A4, two cards to cut',
    sheet: A4_LANDSCAPE,
    box: HALF_A4,
    copies: 2,
    howToPrint: 'at actual size on A4 paper, landscape, double-sided (flip on the short edge), and cut along the dashed line',
  },
};

export function isCardPaperSize(value: unknown): value is CardPaperSize {
  return typeof value === 'string' && (CARD_PAPER_SIZES as readonly string[]).includes(value);
}
