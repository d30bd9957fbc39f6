/**
 * What every page of the card carries: the header (registration, type, card code, book and
 * revision, page number, the demo mark) and the footer (the safety caution, the revision-mark
 * note, where the data came from), and the cut line between the copies of a two-up sheet.
 */
import type { Content } from 'pdfmake/interfaces';
import { DEMO_MARK, SAFETY_CAUTION, utcDate } from '../card/card-presentation';
import type { CardPdfInput } from './card-pdf-input';
import type { CardPaper } from './page-sizes';
import { BAR_WIDTH, INDENT, MONO, boxLayout, monoWidth, utcDay } from './pdf-blocks';
import type { CardChanges } from './revision-marks';

/** The page header, `width` wide. */
export function pageHeader(input: CardPdfInput, currentPage: number, pageCount: number, width: number): Content {
  const { card } = input;
  const rows: Content[] = [
    {
      columns: [
        { width: monoWidth(card.airframe.registration, 19), text: card.airframe.registration, font: MONO, bold: true, fontSize: 19, lineHeight: 0.85 },
        { width: '*', margin: [8, 4, 0, 0], text: [{ text: card.aircraftType.designator, bold: true }, ` · ${card.aircraftType.name}`], fontSize: 8 },
        {
          width: Math.max(monoWidth(input.code ?? '–', 12), 64),
          stack: [
            { text: input.code ? 'CARD CODE' : 'NO CODE YET', bold: true, fontSize: 6, alignment: 'right', characterSpacing: 0.5 },
            { text: input.code ?? '–', font: MONO, bold: true, fontSize: 12, alignment: 'right', lineHeight: 1 },
          ],
        },
      ],
    },
    {
      margin: [0, 2, 0, 0],
      columns: [
        { width: '*', text: `${card.speedBook.title} · revision ${card.revision.number}${card.revision.publishedAt ? `, published ${utcDay(card.revision.publishedAt)}` : ', not published'} · issued ${utcDate(input.issuedAt)}`, fontSize: 7 },
        { width: 48, text: `Page ${currentPage} of ${pageCount}`, fontSize: 7, alignment: 'right' },
      ],
    },
  ];
  if (card.demo) {
    rows.push({
      margin: [0, 4, 0, 0],
      table: { widths: ['*'], body: [[{ text: 'INVENTED DEMO DATA — NOT FOR FLIGHT', bold: true, fontSize: 8, alignment: 'center', characterSpacing: 0.6 }]] },
      layout: boxLayout(1.2),
    });
  }
  rows.push({ canvas: [{ type: 'line', x1: 0, y1: 3, x2: width, y2: 3, lineWidth: 1 }] });
  return { stack: rows, width } as Content;
}

/** The page footer, `width` wide. */
export function pageFooter(input: CardPdfInput, currentPage: number, pageCount: number, width: number): Content {
  const { card } = input;
  const lines: Content[] = [
    { canvas: [{ type: 'line', x1: 0, y1: 0, x2: width, y2: 0, lineWidth: 0.8 }] },
    {
      margin: [0, 3, 0, 0],
      text: [{ text: SAFETY_CAUTION, bold: true }, card.demo ? { text: ` ${DEMO_MARK}`, bold: true } : ''],
      fontSize: 7.5,
    },
    revisionNote(input.changes, card.revision.number),
    {
      columns: [
        { width: '*', text: input.dataAsOf, fontSize: 6 },
        (() => {
          const text = `${card.airframe.registration} · rev ${card.revision.number} · ${input.code ?? 'no code yet'} · ${currentPage}/${pageCount}`;
          return { width: monoWidth(text, 6), text, fontSize: 6, font: MONO };
        })(),
      ],
      columnGap: 6,
      margin: [0, 1, 0, 0],
    },
  ];
  return { stack: lines, width } as Content;
}

/** The footnote that explains the revision bars (or why there are none). */
export function revisionNoteText(changes: CardChanges, revisionNumber: number): string {
  if (!changes.compared) return `Revision marks not shown: revision ${changes.againstRevision ?? revisionNumber - 1} is not on this device, so what changed cannot be told.`;
  if (changes.againstRevision === null) return `Revision ${revisionNumber} is the speed book's first published revision: no revision marks.`;
  if (changes.changed.size === 0) return `No value on this card changed since revision ${changes.againstRevision} (same inputs).`;
  return `Revision mark: a bar at the left of a line means a value on it differs from revision ${changes.againstRevision} for the same inputs.`;
}

function revisionNote(changes: CardChanges, revisionNumber: number): Content {
  const text = revisionNoteText(changes, revisionNumber);
  if (!(changes.compared && changes.changed.size > 0)) return { text, fontSize: 6.5, margin: [0, 1, 0, 0] };
  return {
    margin: [0, 1, 0, 0],
    columns: [
      { width: INDENT, canvas: [{ type: 'rect', x: 0, y: 0, w: BAR_WIDTH, h: 8, color: '#000000' }] },
      { width: '*', text, fontSize: 6.5 },
    ],
  };
}

/** The dashed line between the two copies of a two-up sheet. */
export function cutLine(paper: CardPaper): Content {
  const x = paper.box.width;
  return {
    stack: [
      { canvas: [{ type: 'line', x1: x, y1: 8, x2: x, y2: paper.sheet.height - 8, lineWidth: 0.5, dash: { length: 4, space: 3 } }] },
    ],
    absolutePosition: { x: 0, y: 0 },
  };
}
