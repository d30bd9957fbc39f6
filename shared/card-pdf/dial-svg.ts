/**
 * The airspeed-indicator picture for paper, as an SVG string pdfmake draws with vectors. Same
 * drawing as the screen (`drawDial`, shared/card/indicator-geometry.ts), inked for a monochrome
 * printer: a white face, and each marking told apart by its shape as well as its colour —
 * white arc an outlined band on the inner track, green arc a solid band, yellow arc a striped
 * band, red lines solid, the blue line dashed, every line named by its code.
 */
import type { CanvasElement } from 'pdfmake/interfaces';
import type { CardIndicator } from '../card/card';
import { DIAL_CENTRE, DIAL_FACE_RADIUS, drawDial, type DialArc, type DialLine } from '../card/indicator-geometry';
import { CARD_FONTS } from './fonts';

export const INK = {
  black: '#000000',
  green: '#1e7b34',
  yellow: '#f0c020',
  red: '#c41e1e',
  blue: '#1f5fbf',
} as const;

const esc = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** One arc's band, drawn so it reads without colour. */
export function arcSvg(arc: Pick<DialArc, 'colour' | 'path'>, width = 9): string {
  switch (arc.colour) {
    case 'white':
      // An outlined band: black edges, paper inside.
      return `<path d="${arc.path}" fill="none" stroke="${INK.black}" stroke-width="${width}"/><path d="${arc.path}" fill="none" stroke="#ffffff" stroke-width="${width - 4.6}"/>`;
    case 'green':
      return `<path d="${arc.path}" fill="none" stroke="${INK.green}" stroke-width="${width}"/>`;
    case 'yellow':
      // Yellow with black stripes across it.
      return `<path d="${arc.path}" fill="none" stroke="${INK.yellow}" stroke-width="${width}"/><path d="${arc.path}" fill="none" stroke="${INK.black}" stroke-width="${width}" stroke-dasharray="1.6 2.4"/>`;
  }
}

export function lineStroke(line: Pick<DialLine, 'colour'>): string {
  return line.colour === 'blue' ? `stroke="${INK.blue}" stroke-width="3.4" stroke-dasharray="4 2"` : `stroke="${INK.red}" stroke-width="3.4"`;
}

/** The dial, in the screen's view box, with `caption` under the unit (e.g. "at 4,500 kg"). */
export function dialSvg(indicator: CardIndicator, caption: string): string {
  const drawing = drawDial(indicator);
  const C = DIAL_CENTRE;
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="-34 -22 308 284" width="308" height="284">`);
  parts.push(`<circle cx="${C}" cy="${C}" r="${DIAL_FACE_RADIUS + 2}" fill="#ffffff" stroke="${INK.black}" stroke-width="2.5"/>`);
  for (const arc of drawing.arcs) parts.push(arcSvg(arc));
  for (const tick of drawing.ticks) {
    parts.push(`<line x1="${tick.x1}" y1="${tick.y1}" x2="${tick.x2}" y2="${tick.y2}" stroke="${INK.black}" stroke-width="${tick.major ? 2.2 : 1}"/>`);
  }
  for (const number of drawing.numbers) {
    // Baseline a third of the size below the point, so the figure is centred on it.
    parts.push(`<text x="${number.x}" y="${number.y + 4.5}" font-family="${CARD_FONTS.figures}" font-size="13" text-anchor="middle" fill="${INK.black}">${esc(number.text)}</text>`);
  }
  for (const line of drawing.lines) {
    parts.push(`<line x1="${line.x1}" y1="${line.y1}" x2="${line.x2}" y2="${line.y2}" ${lineStroke(line)}/>`);
    parts.push(
      `<text x="${line.labelX}" y="${line.labelY + 4}" font-family="${CARD_FONTS.text}" font-weight="bold" font-size="12" text-anchor="${line.labelAnchor}" fill="${INK.black}">${esc(line.code)}</text>`,
    );
  }
  parts.push(`<text x="${C}" y="${C - 4}" font-family="${CARD_FONTS.text}" font-weight="bold" font-size="15" text-anchor="middle" fill="${INK.black}">${drawing.unit}</text>`);
  if (caption) parts.push(`<text x="${C}" y="${C + 14}" font-family="${CARD_FONTS.text}" font-size="11" text-anchor="middle" fill="${INK.black}">${esc(caption)}</text>`);
  parts.push('</svg>');
  return parts.join('');
}

/**
 * The same swatch as pdfmake canvas vectors, `width` × 8 pt: the marking straight, shaped as on
 * the dial (outlined, solid, striped; a solid or dashed radial line). Canvas vectors cost a
 * fraction of an SVG in pdfmake, and the legend has one per marking.
 */
export function swatchCanvas(mark: { kind: 'arc'; arc: Pick<DialArc, 'colour'> } | { kind: 'line'; line: Pick<DialLine, 'colour'> }, width = 22): CanvasElement[] {
  const h = 6;
  const y = 1;
  if (mark.kind === 'line') {
    const x = width / 2;
    return mark.line.colour === 'blue'
      ? [{ type: 'line', x1: x, y1: 0, x2: x, y2: 8, lineWidth: 2.4, lineColor: INK.blue, dash: { length: 2, space: 1 } }]
      : [{ type: 'line', x1: x, y1: 0, x2: x, y2: 8, lineWidth: 2.4, lineColor: INK.red }];
  }
  switch (mark.arc.colour) {
    case 'white':
      return [
        { type: 'rect', x: 0, y, w: width, h, color: INK.black },
        { type: 'rect', x: 0, y: y + 1.4, w: width, h: h - 2.8, color: '#ffffff' },
      ];
    case 'green':
      return [{ type: 'rect', x: 0, y, w: width, h, color: INK.green }];
    case 'yellow': {
      const stripes: CanvasElement[] = [];
      for (let x = 0.8; x < width; x += 2.6) stripes.push({ type: 'rect', x, y, w: 1.1, h, color: INK.black });
      return [{ type: 'rect', x: 0, y, w: width, h, color: INK.yellow }, ...stripes];
    }
  }
}
