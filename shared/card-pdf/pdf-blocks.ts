/**
 * The building blocks of the printed card's layout, shared by every part of the page: the card
 * box's margins, the revision-bar column, the figures' monospaced font and its width, the table
 * layouts, headings, fine print and the caution box.
 */
import type { Content, CustomTableLayout, TableCell } from 'pdfmake/interfaces';
import { utcDate } from '../card/card-presentation';
import { CARD_FONTS } from './fonts';

/** The card box's margins, pt. The left one holds the revision bars. */
export const MARGIN = { left: 14, right: 18, bottom: 54 } as const;
export const TOP = { plain: 56, demo: 70 } as const;
/** The revision-bar column at the left of every table, and the indent of everything else to line up with the tables' text. */
export const BAR_WIDTH = 3.5;
export const INDENT = BAR_WIDTH + 4;

export const GREY = '#e4e4e4';

/** "1 Dec 2026" (UTC). */
export const utcDay = (iso: string) => utcDate(iso).replace(/, \d\d:\d\d UTC$/, '');

/**
 * The width of `text` in Roboto Mono at `size` pt: every glyph advances 1229/2048 em (0.6 em;
 * fontkit reads it from the font). pdfmake squeezes 'auto' columns beside a long '*' column, so
 * the registration and the code get their exact width instead, never wrapped.
 */
export const monoWidth = (text: string, size: number) => Math.ceil(text.length * size * (1229 / 2048)) + 2;
/** The figures' font (Roboto Mono). */
export const MONO = CARD_FONTS.figures;

export function boxLayout(width: number): CustomTableLayout {
  return {
    hLineWidth: () => width,
    vLineWidth: () => width,
    paddingTop: () => 1.5,
    paddingBottom: () => 1,
  };
}

/** Rules between rows, none between columns; the first column is the revision bar, without padding. */
export const FIGURES_LAYOUT: CustomTableLayout = {
  hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 0 : i === (node.table.headerRows ?? 0) ? 0.9 : 0.3),
  vLineWidth: () => 0,
  hLineColor: (i, node) => (i === (node.table.headerRows ?? 0) ? '#000000' : '#8a8a8a'),
  paddingLeft: (i) => (i === 0 ? 0 : i === 1 ? 4 : 2.5),
  paddingRight: (i) => (i === 0 ? 0 : 2.5),
  paddingTop: () => 1.4,
  paddingBottom: () => 1.1,
};

export const bar = (marked: boolean): TableCell => (marked ? { text: '', fillColor: '#000000' } : { text: '' });
export const head = (text: string, alignment: 'left' | 'right' = 'right'): TableCell => ({ text, bold: true, fontSize: 6.5, alignment });
/** Roboto Mono's line box is tall (its ascender and descender span about 1.3 em): figures sit closer. */
export const num = (text: string, extra: Record<string, unknown> = {}): TableCell => ({ text, font: MONO, alignment: 'right', lineHeight: 0.9, ...extra });

/** A section's heading. */
export function title(text: string, marginTop = 7): Content {
  return { text, bold: true, fontSize: 9, margin: [INDENT, marginTop, 0, 2] };
}

/** Fine print under a table. */
export function fine(text: string): Content {
  return { text, fontSize: 6.3, margin: [INDENT, 1.5, 0, 0] };
}

/** A boxed caution line. */
export function caution(text: string): Content {
  return {
    margin: [INDENT, 3, 0, 0],
    table: { widths: ['auto', '*'], body: [[{ text: 'CAUTION', bold: true, fontSize: 7 }, { text, fontSize: 7 }]] },
    layout: boxLayout(0.8),
  };
}
