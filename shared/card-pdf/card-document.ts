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
 */
import type { Content, CustomTableLayout, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import {
  DEMO_MARK,
  SAFETY_CAUTION,
  cardNumber,
  cruiseWords,
  limitKindWords,
  limitRows,
  phaseGroups,
  showsWeightColumn,
  signedCardNumber,
  utcDate,
} from '../card/card-presentation';
import { drawDial } from '../card/indicator-geometry';
import { dialSvg, swatchCanvas } from './dial-svg';
import { cardPdfFileName } from './file-name';
import { CARD_FONTS } from './fonts';
import { CARD_PAPERS, type CardPaper, type CardPaperSize } from './page-sizes';
import { qrVector } from './qr';
import { lineKey, type CardChanges } from './revision-marks';

export interface CardPdfInput {
  /** `buildCard`'s result (it carries its context: airframe, type, book, demo). */
  readonly card: SpeedCard;
  /**
   * The card-log entry's check code (printed form), printed as text and inside the QR code's
   * URL; null for a card issued offline that the server has not recorded yet (no code exists).
   */
  readonly code: string | null;
  /** The check URL on the operator's Speedwright host (the QR code holds it); null with no code. */
  readonly checkUrl: string | null;
  /** When the card was issued, ISO 8601. */
  readonly issuedAt: string;
  /** Where the data came from and how fresh it is, one sentence ("Data as of 2 Dec 2026, 01:30 UTC: …"). */
  readonly dataAsOf: string;
  /** Lines that changed since the previous revision (revision-marks.ts). */
  readonly changes: CardChanges;
  readonly paper: CardPaperSize;
}

/** The card box's margins, pt. The left one holds the revision bars. */
const MARGIN = { left: 14, right: 18, bottom: 54 } as const;
const TOP = { plain: 56, demo: 70 } as const;
/** The revision-bar column at the left of every table, and the indent of everything else to line up with the tables' text. */
const BAR_WIDTH = 3.5;
const INDENT = BAR_WIDTH + 4;

const GREY = '#e4e4e4';

/**
 * The width of `text` in Roboto Mono at `size` pt: every glyph advances 1229/2048 em (0.6 em;
 * fontkit reads it from the font). pdfmake squeezes 'auto' columns beside a long '*' column, so
 * the registration and the code get their exact width instead, never wrapped.
 */
/** "1 Dec 2026" (UTC). */
const utcDay = (iso: string) => utcDate(iso).replace(/, \d\d:\d\d UTC$/, '');

const monoWidth = (text: string, size: number) => Math.ceil(text.length * size * (1229 / 2048)) + 2;
const MONO = CARD_FONTS.figures;

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
    header: (currentPage: number, pageCount: number) => furniture(() => header(input, currentPage, pageCount, contentWidth), 14),
    footer: (currentPage: number, pageCount: number) => furniture(() => footer(input, currentPage, pageCount, contentWidth), 6),
    background: paper.copies === 2 ? () => cutLine(paper) : undefined,
    content: [twice(() => front(input, contentWidth)), { stack: [twice(() => back(input, contentWidth))], pageBreak: 'before' }],
  };
  return { definition, fileName: cardPdfFileName(card.airframe.registration, card.revision.number, input.issuedAt) };
}

// ---------------------------------------------------------------------------------------------
// Page furniture

function header(input: CardPdfInput, currentPage: number, pageCount: number, width: number): Content {
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

function footer(input: CardPdfInput, currentPage: number, pageCount: number, width: number): Content {
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

function cutLine(paper: CardPaper): Content {
  const x = paper.box.width;
  return {
    stack: [
      { canvas: [{ type: 'line', x1: x, y1: 8, x2: x, y2: paper.sheet.height - 8, lineWidth: 0.5, dash: { length: 4, space: 3 } }] },
    ],
    absolutePosition: { x: 0, y: 0 },
  };
}

// ---------------------------------------------------------------------------------------------
// Tables

function boxLayout(width: number): CustomTableLayout {
  return {
    hLineWidth: () => width,
    vLineWidth: () => width,
    paddingTop: () => 1.5,
    paddingBottom: () => 1,
  };
}

/** Rules between rows, none between columns; the first column is the revision bar, without padding. */
const FIGURES_LAYOUT: CustomTableLayout = {
  hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 0 : i === (node.table.headerRows ?? 0) ? 0.9 : 0.3),
  vLineWidth: () => 0,
  hLineColor: (i, node) => (i === (node.table.headerRows ?? 0) ? '#000000' : '#8a8a8a'),
  paddingLeft: (i) => (i === 0 ? 0 : i === 1 ? 4 : 2.5),
  paddingRight: (i) => (i === 0 ? 0 : 2.5),
  paddingTop: () => 1.4,
  paddingBottom: () => 1.1,
};

const bar = (marked: boolean): TableCell => (marked ? { text: '', fillColor: '#000000' } : { text: '' });
const head = (text: string, alignment: 'left' | 'right' = 'right'): TableCell => ({ text, bold: true, fontSize: 6.5, alignment });
/** Roboto Mono's line box is tall (its ascender and descender span about 1.3 em): figures sit closer. */
const num = (text: string, extra: Record<string, unknown> = {}): TableCell => ({ text, font: MONO, alignment: 'right', lineHeight: 0.9, ...extra });

function title(text: string, marginTop = 7): Content {
  return { text, bold: true, fontSize: 9, margin: [INDENT, marginTop, 0, 2] };
}

function fine(text: string): Content {
  return { text, fontSize: 6.3, margin: [INDENT, 1.5, 0, 0] };
}

// ---------------------------------------------------------------------------------------------
// Front: inputs, code, speeds, limits, stall in a turn

function front(input: CardPdfInput, width: number): Content {
  const { card, changes } = input;
  const marked = (key: string) => changes.changed.has(key);
  const qrSize = 76;
  const check = checkBlock(input.checkUrl, qrSize);

  const inputsTable: Content = {
    table: { widths: [BAR_WIDTH, 56, '*'], body: inputRows(card).map(([label, value, key]) => [bar(key !== null && marked(key)), { text: label, bold: true }, { text: value }]) },
    layout: { ...FIGURES_LAYOUT, hLineWidth: () => 0, paddingTop: () => 0.8, paddingBottom: () => 0.8 },
  };

  const showWeight = showsWeightColumn(card);
  const speedWidths = showWeight ? [BAR_WIDTH, 36, '*', 34, 44, 34] : [BAR_WIDTH, 36, '*', 48, 36];
  const speedBody: TableCell[][] = [
    [bar(false), head('Speed', 'left'), head('Meaning · configuration', 'left'), ...(showWeight ? [head('At kg')] : []), head('IAS kt'), head('CAS kt')],
  ];
  for (const group of phaseGroups(card)) {
    const span = speedWidths.length - 1;
    speedBody.push([bar(false), { text: group.title.toUpperCase(), bold: true, fontSize: 6, lineHeight: 1, colSpan: span, fillColor: GREY, characterSpacing: 0.6 }, ...Array.from({ length: span - 1 }, () => ({ text: '' }))]);
    for (const speed of group.speeds) {
      speedBody.push([
        bar(marked(lineKey.speed(speed.code, speed.configurationKey))),
        { text: speed.code, font: MONO, bold: true, fontSize: 10, lineHeight: 0.9, margin: [0, 1.5, 0, 0] },
        { text: [speed.label, { text: ` · ${speed.configurationLabel}`, fontSize: 6.3 }], margin: [0, 2.2, 0, 0] },
        ...(showWeight ? [num(cardNumber(speed.weightKg), { margin: [0, 2.5, 0, 0] })] : []),
        num(cardNumber(speed.iasKt), { bold: true, fontSize: 13.5 }),
        num(cardNumber(speed.casKt), { fontSize: 8.5, margin: [0, 2, 0, 0] }),
      ]);
    }
  }

  const limitBody: TableCell[][] = [[bar(false), head('Limit', 'left'), head('Meaning', 'left'), head('IAS'), head('CAS')]];
  for (const row of limitRows(card)) {
    limitBody.push([
      bar(marked(lineKey.limit(row.key))),
      { text: row.code, font: MONO, bold: true, lineHeight: 0.9 },
      { text: row.meaning, fontSize: 6.5 },
      num(cardNumber(row.iasKt), { bold: true, fontSize: 9 }),
      num(cardNumber(row.casKt)),
    ]);
  }
  if (card.limits.mmo !== null) {
    limitBody.push([bar(marked(lineKey.limit('MMO'))), { text: 'MMO', font: MONO, bold: true, lineHeight: 0.9 }, { text: 'Maximum operating Mach', fontSize: 6.5 }, num(`M ${cardNumber(card.limits.mmo, 3)}`, { colSpan: 2, bold: true, fontSize: 9 }), { text: '' }]);
  }
  if (card.crossoverAltitudeFt !== null) {
    limitBody.push([bar(marked(lineKey.limit('crossover'))), { text: 'Crossover', bold: true, fontSize: 6.5 }, { text: 'VMO below, MMO above', fontSize: 6.5 }, num(`${cardNumber(card.crossoverAltitudeFt)} ft`, { colSpan: 2 }), { text: '' }]);
  }

  const basis = card.limits.basis === 'ias' ? 'IAS' : 'CAS';
  const content: Content[] = [
    {
      columns: [
        { width: '*', stack: [{ text: 'INPUTS OF THIS CARD', bold: true, fontSize: 6.5, characterSpacing: 0.6, margin: [INDENT, 0, 0, 1.5] }, inputsTable] },
        { width: qrSize, stack: check },
      ],
      columnGap: 6,
    },
    title(`Speeds at ${cardNumber(card.inputs.weightKg)} kg`, 5),
    { table: { headerRows: 1, dontBreakRows: true, widths: speedWidths, body: speedBody }, layout: FIGURES_LAYOUT },
    fine(`IAS through the speed book's position-error table. Stall and minimum speeds (V2, VREF, VMC) rounded up, limits down, other speeds to the nearest knot.${showWeight ? ' Approach and landing speeds at the landing weight.' : ''}`),
    {
      stack: [
        title('Limits', 5),
        { table: { headerRows: 1, widths: [BAR_WIDTH, 36, '*', 36, 30], body: limitBody }, layout: FIGURES_LAYOUT },
        fine(`Kt, rounded down (VMC up); limits in ${basis} as the speed book states them.`),
      ],
      unbreakable: true,
    },
  ];
  if (input.changes.removed.length) {
    content.push(fine(`Given by revision ${input.changes.againstRevision} but not by this one: ${input.changes.removed.join('; ')}.`));
  }
  void width;
  return { stack: content };
}

/** The QR code of the check URL with a line on how to check; or, with no code yet, why not. */
function checkBlock(checkUrl: string | null, size: number): Content[] {
  if (checkUrl === null) {
    return [
      {
        table: {
          widths: ['*'],
          body: [[{ stack: [{ text: 'NOT YET CHECKABLE', bold: true, fontSize: 6.5 }, { text: 'Issued offline: the card log gives this card its check code when the device next reaches the server. Print it again then for a card anyone can check.', fontSize: 5.8 }] }]],
        },
        layout: boxLayout(1),
      },
    ];
  }
  let host = checkUrl;
  try {
    host = new URL(checkUrl).host;
  } catch {
    // Not a URL: printed as given.
  }
  return [
    { canvas: qrVector(checkUrl, size).canvas, width: size, height: size } as Content,
    { text: `Scan, or open ${host}/check and type the code, to see whether this card is current.`, fontSize: 5.8, alignment: 'center' },
  ];
}

/** Label, value and the revision-mark key of each input line. */
function inputRows(card: SpeedCard): [string, string, string | null][] {
  const i = card.inputs;
  // A QNH reads as four figures, never with a thousands comma.
  const qnh = (hpa: number) => cardNumber(hpa, 1).replace(/,/g, '');
  const aerodrome = (a: NonNullable<SpeedCard['inputs']['arrival']>) =>
    `elevation ${cardNumber(a.elevationFt)} ft · QNH ${qnh(a.qnhHpa)} hPa · OAT ${cardNumber(a.oatC, 1)} °C${a.dewPointC === undefined ? '' : ` · dew point ${cardNumber(a.dewPointC, 1)} °C`}`;
  const landing = `${cardNumber(card.landing.weightKg)} kg landing${card.landing.source === 'entered' ? '' : card.landing.source === 'takeoff-weight' ? ' (the takeoff weight)' : ' (the maximum landing weight)'}`;
  return [
    ['Weight', `${cardNumber(i.weightKg)} kg takeoff · ${landing}`, null],
    ['Configuration', `${card.takeoffConfiguration.label} (takeoff)`, lineKey.takeoffConfiguration()],
    ['Departure', aerodrome(i.departure), null],
    ['Arrival', i.arrival ? aerodrome(i.arrival) : 'as at departure', null],
    ['En route', `ISA ${signedCardNumber(i.isaDeviationC)} °C · table every ${cardNumber(i.altitudeStepFt)} ft`, null],
    ['Planned cruise', cruiseWords(card), lineKey.cruise()],
  ];
}

// ---------------------------------------------------------------------------------------------
// Back: aerodromes, indicator, altitude table

function back(input: CardPdfInput, width: number): Content {
  const { card, changes } = input;
  const marked = (key: string) => changes.changed.has(key);

  const aerodromeBody: TableCell[][] = [[bar(false), head('Aerodrome', 'left'), head('Press. alt. ft'), head('Dens. alt. ft'), head('ISA dev. °C')]];
  const aerodromeRow = (name: string, a: SpeedCard['departure']): TableCell[] => [bar(false), { text: name, bold: true }, num(cardNumber(a.pressureAltitudeFt), { fontSize: 8.5 }), num(cardNumber(a.densityAltitudeFt), { fontSize: 8.5, bold: a.highDensityAltitude }), num(signedCardNumber(a.isaDeviationC), { fontSize: 8.5 })];
  aerodromeBody.push(aerodromeRow('Departure', card.departure));
  if (card.arrival) aerodromeBody.push(aerodromeRow('Arrival', card.arrival));

  const cautions: Content[] = [];
  if (card.landing.source === 'maximum-landing-weight') cautions.push(caution(card.landing.statement));
  if (card.departure.highDensityAltitude) {
    cautions.push(caution(`High density altitude at departure (${cardNumber(card.departure.densityAltitudeFt)} ft): expect a longer takeoff run and a weaker climb.`));
  }
  if (card.arrival?.highDensityAltitude) {
    cautions.push(caution(`High density altitude at arrival (${cardNumber(card.arrival.densityAltitudeFt)} ft): expect a higher true airspeed on final and a longer landing roll.`));
  }

  const drawing = drawDial(card.indicator);
  const legendBody: TableCell[][] = [
    ...drawing.arcs.map((arc): TableCell[] => [bar(marked(lineKey.arc(arc.colour))), { canvas: swatchCanvas({ kind: 'arc', arc }), margin: [0, 1, 0, 0] } as TableCell, { text: [`${arc.words}: `, { text: arc.range, font: MONO, bold: true }, ' kt'], fontSize: 6.8 }]),
    ...drawing.lines.map((line): TableCell[] => [bar(marked(lineKey.line(line.code))), { canvas: swatchCanvas({ kind: 'line', line }), margin: [0, 0.5, 0, 0] } as TableCell, { text: [`${line.words}: `, { text: String(line.kt), font: MONO, bold: true }, ' kt'], fontSize: 6.8 }]),
  ];
  const dialWidth = 140;
  const indicator: Content = {
    columns: [
      { width: dialWidth, svg: dialSvg(card.indicator, `at ${cardNumber(card.inputs.weightKg)} kg`), margin: [INDENT - 4, 0, 0, 0] },
      {
        width: '*',
        stack: [
          { text: `Markings in ${drawing.basisWords}, as the speed book states, at this card's weight.`, fontSize: 6.8, margin: [INDENT, 4, 0, 3] },
          legendBody.length
            ? { table: { widths: [BAR_WIDTH, 24, '*'], body: legendBody }, layout: { ...FIGURES_LAYOUT, hLineWidth: () => 0, paddingTop: () => 1.2, paddingBottom: () => 1.2 } }
            : { text: 'The speed book gives no indicator markings.', margin: [INDENT, 0, 0, 0] },
        ],
      },
    ],
    columnGap: 4,
    unbreakable: true,
  };

  const altitudeBody: TableCell[][] = [
    [bar(false), head('Press. alt. ft'), head('OAT °C'), head('IAS kt'), head('CAS'), head('EAS'), head('TAS'), head('Mach'), head('IAS limit kt')],
  ];
  for (const row of card.altitudeTable) {
    const fill = row.aboveLimit ? { fillColor: GREY } : {};
    altitudeBody.push([
      bar(marked(lineKey.altitude(row.pressureAltitudeFt))),
      num(cardNumber(row.pressureAltitudeFt), { bold: true, ...fill }),
      num(cardNumber(row.oatC, 1), fill),
      num(cardNumber(row.iasKt), { bold: true, ...fill }),
      num(cardNumber(row.casKt), fill),
      num(cardNumber(row.easKt), fill),
      num(cardNumber(row.tasKt), fill),
      num(cardNumber(row.mach, 3), fill),
      {
        text: [
          { text: cardNumber(row.limitIasKt), font: MONO },
          row.limitKind ? { text: ` ${limitKindWords(row.limitKind)}`, fontSize: 5.5 } : '',
          row.aboveLimit ? { text: ' OVER', bold: true, fontSize: 6 } : '',
        ],
        alignment: 'right',
        ...fill,
      },
    ]);
  }
  const stallBody: TableCell[][] = [[bar(false), head('Bank°'), head('g'), head('IAS'), head('CAS')]];
  for (const line of card.stallInTurn) {
    stallBody.push([bar(marked(lineKey.stall(line.bankDeg))), num(String(line.bankDeg)), num(cardNumber(line.loadFactor, 2)), num(cardNumber(line.iasKt), { bold: true, fontSize: 9 }), num(cardNumber(line.casKt))]);
  }
  void width;
  return {
    stack: [
      {
        columns: [
          {
            width: '*',
            stack: [
              title('Departure and arrival', 0),
              { table: { headerRows: 1, widths: [BAR_WIDTH, '*', 38, 38, 38], body: aerodromeBody }, layout: FIGURES_LAYOUT },
              ...cautions,
            ],
          },
          ...(card.stallInTurn.length
            ? [{ width: 112, stack: [title('Stall in a level turn', 0), { table: { headerRows: 1, widths: [BAR_WIDTH, '*', 20, 22, 22], body: stallBody }, layout: FIGURES_LAYOUT }, fine('Kt, from VS1 at the takeoff weight, rounded up.')] } as Content]
            : []),
        ],
        columnGap: 8,
      },
      title('Airspeed indicator at this weight'),
      indicator,
      title(`Altitude table · planned cruise ${cruiseWords(card)} · ISA ${signedCardNumber(card.inputs.isaDeviationC)} °C`),
      { table: { headerRows: 1, dontBreakRows: true, widths: [BAR_WIDTH, 40, 30, 30, 26, 26, 26, 30, '*'], body: altitudeBody }, layout: { ...FIGURES_LAYOUT, paddingTop: () => 0.9, paddingBottom: () => 0.3 }, fontSize: 7 } as Content,
      fine('“–”: no IAS for this CAS in the position-error table. Limits rounded down. OVER (shaded): the planned cruise is above the limit.'),
      ...[...new Set(card.altitudeTable.map((row) => row.cruiseNote).filter((note): note is string => note !== null))].map((note) => fine(`“–”: ${note}`)),
    ],
  };
}

function caution(text: string): Content {
  return {
    margin: [INDENT, 3, 0, 0],
    table: { widths: ['auto', '*'], body: [[{ text: 'CAUTION', bold: true, fontSize: 7 }, { text, fontSize: 7 }]] },
    layout: boxLayout(0.8),
  };
}
