/**
 * The check URL as a QR code drawn with vectors: the `qrcode` package lays out the modules, and
 * each run of dark modules in a row becomes one filled rectangle of a pdfmake canvas (crisp at
 * any print resolution, no image). Measured: a thousand canvas rectangles cost about 2 ms of a
 * card, the same squares as one SVG path over 100 ms (pdfmake's SVG renderer), and a canvas
 * `path` is placed at the page's origin, not the node's. Error correction M (15 %: survives a crease or a pencil mark).
 */
import type { CanvasElement } from 'pdfmake/interfaces';
import { create } from 'qrcode';

export interface QrVector {
  /** Modules per side, without the quiet zone. */
  readonly modules: number;
  /** The dark runs, pt from the top left corner of the code (quiet zone included). */
  readonly rects: readonly { readonly x: number; readonly y: number; readonly w: number; readonly h: number }[];
  /** The runs as filled canvas rectangles. */
  readonly canvas: CanvasElement[];
}

/** `text` as a QR code `sizePt` wide, quiet zone included (four modules each side, as the standard asks). */
export function qrVector(text: string, sizePt: number): QrVector {
  const qr = create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  const quiet = 4;
  const cell = sizePt / (n + 2 * quiet);
  const rects: { x: number; y: number; w: number; h: number }[] = [];
  for (let row = 0; row < n; row++) {
    let col = 0;
    while (col < n) {
      if (!qr.modules.get(row, col)) {
        col++;
        continue;
      }
      const start = col;
      while (col < n && qr.modules.get(row, col)) col++;
      // A hair of overlap so neighbouring rows print without white seams.
      rects.push({ x: (quiet + start) * cell, y: (quiet + row) * cell, w: (col - start) * cell, h: cell + 0.05 });
    }
  }
  return { modules: n, rects, canvas: rects.map((rect): CanvasElement => ({ type: 'rect', ...rect, color: '#000000' })) };
}
