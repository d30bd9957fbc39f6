/**
 * The printed speed card as one pdfmake document definition, the same in the browser and in Node
 * (pure data and small layout functions; no DOM, no Node, no fonts loaded here — see fonts.ts).
 *
 * A card is two kneeboard pages: the front has the inputs, the check code and its QR code, the
 * speeds by phase, the limits and the stall speeds in a turn; the back has the aerodromes, the
 * airspeed-indicator picture and the altitude table (which runs on to further pages when the
 * rows need it). Every page carries the registration, revision and code at the top and the
 * caution (and the demo mark) at the bottom. The two-up sheets carry two copies of each page
 * side by side, with a dashed cut line between them: printed double-sided (flip on the short
 * edge) and cut, each half is a whole card.
 *
 * Monochrome-friendly: black text on white, no meaning in colour alone (arcs and lines are told
 * apart by their shape and named in the legend; "OVER" is a word; revision marks are black bars).
 * Figures are Roboto Mono, the speeds large.
 *
 * The parts, one a file: page-furniture.ts (header, footer, cut line), front-page.ts with
 * inputs-block.ts and speeds-block.ts, back-page.ts with indicator-block.ts and
 * altitude-block.ts, and pdf-blocks.ts (margins, fonts, table layouts shared by all).
 */
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces';
import { backPage } from './back-page';
import type { CardPdfInput } from './card-pdf-input';
import { cardPdfFileName } from './file-name';
import { CARD_FONTS } from './fonts';
import { frontPage } from './front-page';
import { CARD_PAPERS } from './page-sizes';
import { cutLine, pageFooter, pageHeader } from './page-furniture';
import { MARGIN, TOP } from './pdf-blocks';

export type { CardPdfInput } from './card-pdf-input';
export { revisionNoteText } from './page-furniture';

export interface CardPdf {
  readonly definition: TDocumentDefinitions;
  readonly fileName: string;
}

/** The document definition and file name of the printed card. Build a fresh one per render: pdfmake writes into it. */
export function cardPdf(input: CardPdfInput): CardPdf {
  const paper = CARD_PAPERS[input.paper];
  const { card } = input;
  const top = card.demo ? TOP.demo : TOP.plain;
  const gap = MARGIN.left + MARGIN.right;
  const contentWidth = paper.box.width - MARGIN.left - MARGIN.right;
  const twice = (make: () => Content): Content => (paper.copies === 2 ? { columns: [make(), make()], columnGap: gap } : make());
  /** Header and footer sit in the page's margins: they carry the card's side margins themselves. */
  const furniture = (make: () => Content, top: number): Content => ({ stack: [twice(make)], margin: [MARGIN.left, top, MARGIN.right, 0] });

  const definition: TDocumentDefinitions = {
    pageSize: { width: paper.sheet.width, height: paper.sheet.height },
    pageMargins: [MARGIN.left, top, MARGIN.right, MARGIN.bottom],
    info: {
      title: `${card.airframe.registration} speed card, revision ${card.revision.number}`,
      subject: `${card.aircraftType.designator} speed card${input.code ? `, code ${input.code}` : ', no check code yet'}`,
      author: 'Speedwright',
      creator: 'Speedwright',
      producer: 'Speedwright (pdfmake)',
    },
    defaultStyle: { font: CARD_FONTS.text, fontSize: 7.5, lineHeight: 1.1, color: '#000000' },
    header: (currentPage: number, pageCount: number) => furniture(() => pageHeader(input, currentPage, pageCount, contentWidth), 14),
    footer: (currentPage: number, pageCount: number) => furniture(() => pageFooter(input, currentPage, pageCount, contentWidth), 6),
    background: paper.copies === 2 ? () => cutLine(paper) : undefined,
    content: [twice(() => frontPage(input, contentWidth)), { stack: [twice(() => backPage(input, contentWidth))], pageBreak: 'before' }],
  };
  return { definition, fileName: cardPdfFileName(card.airframe.registration, card.revision.number, input.issuedAt) };
}
