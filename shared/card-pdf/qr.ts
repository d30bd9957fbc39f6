/**
 * The check URL as a QR code drawn with vectors: the `qrcode` package lays out the modules, and
 * each run of dark modules in a row becomes one filled rectangle of a pdfmake canvas (crisp at
 * any print resolution, no image). Error correction M (15 %: survives a crease or a pencil mark).
 */
import type { CanvasElement } from 'pdfmake/interfaces';
import { create } from 'qrcode';

export interface QrVector {
  /** Modules per side, without the quiet zone. */
  readonly modules: number;
  readonly canvas: CanvasElement[];
}

/** `text` as a QR code `sizePt` wide, quiet zone included (four modules each side, as the standard asks). */
export function qrVector(text: string, sizePt: number): QrVector {
  const qr = create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  const quiet = 4;
  const cell = sizePt / (n + 2 * quiet);
  const canvas: CanvasElement[] = [];
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
      canvas.push({ type: 'rect', x: (quiet + start) * cell, y: (quiet + row) * cell, w: (col - start) * cell, h: cell + 0.05, color: '#000000' });
    }
  }
  return { modules: n, canvas };
}
