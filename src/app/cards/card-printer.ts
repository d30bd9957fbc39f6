import { DOCUMENT } from '@angular/common';
import { Injectable, inject } from '@angular/core';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { BROWSER_FONT_PATH, cardFontDictionary, cardFontFiles, type CardFontFile } from '../../../shared/card-pdf/fonts';
import { woffToSfnt } from '../../../shared/card-pdf/woff';

type PdfMake = typeof import('pdfmake/build/pdfmake');

/** Why a PDF could not be made, in a sentence for the screen. */
export class CardPrintError extends Error {
  override readonly name = 'CardPrintError';
}

/** zlib inflate with the browser's own DecompressionStream (WOFF tables are zlib streams). */
async function inflate(data: Uint8Array): Promise<Uint8Array> {
  const stream = new Blob([data as BlobPart]).stream().pipeThrough(new DecompressionStream('deflate'));
  return new Uint8Array(await new Response(stream).arrayBuffer());
}

function base64(bytes: Uint8Array): string {
  let text = '';
  for (let i = 0; i < bytes.length; i += 0x8000) text += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(text);
}

const sfntName = (font: CardFontFile) => font.file.replace(/\.woff$/, '.ttf');

/**
 * Makes the printed card's PDF on this device. pdfmake and the fonts load on the first print
 * (pdfmake is its own lazy chunk, kept out of the initial bundle; the fonts are the app's
 * `/pdf-fonts/` assets, which the service worker prefetches), so printing works offline.
 */
@Injectable({ providedIn: 'root' })
export class CardPrinter {
  private readonly document = inject(DOCUMENT);
  private loading: Promise<PdfMake> | null = null;

  /** pdfmake with the card's fonts; the first call loads them. */
  private load(): Promise<PdfMake> {
    this.loading ??= (async () => {
      const pdfMake = (await import('pdfmake/build/pdfmake')).default as unknown as PdfMake;
      const vfs: Record<string, string> = {};
      await Promise.all(
        cardFontFiles().map(async (font) => {
          let response: Response;
          try {
            response = await fetch(`${BROWSER_FONT_PATH}${font.file}`);
          } catch {
            throw new CardPrintError('The print fonts are not on this device yet. Open Speedwright once with a network connection, then print again.');
          }
          if (!response.ok) throw new CardPrintError('The print fonts could not be loaded. Reload Speedwright, then print again.');
          vfs[sfntName(font)] = base64(await woffToSfnt(new Uint8Array(await response.arrayBuffer()), inflate));
        }),
      );
      pdfMake.addVirtualFileSystem(vfs);
      pdfMake.setFonts(cardFontDictionary(sfntName));
      return pdfMake;
    })();
    this.loading.catch(() => (this.loading = null));
    return this.loading;
  }

  /** The PDF of `definition` (a fresh one: pdfmake writes into it). */
  async pdf(definition: TDocumentDefinitions): Promise<Blob> {
    const pdfMake = await this.load();
    const output = pdfMake.createPdf(definition) as unknown as { getBlob(): Promise<Blob> };
    return output.getBlob();
  }

  /** Makes the PDF and hands it to the browser as a download named `fileName`. */
  async download(definition: TDocumentDefinitions, fileName: string): Promise<Blob> {
    const blob = await this.pdf(definition);
    const url = URL.createObjectURL(blob);
    const link = this.document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.rel = 'noopener';
    this.document.body.appendChild(link);
    link.click();
    link.remove();
    // Long enough for the browser to start the download, then the memory goes.
    setTimeout(() => URL.revokeObjectURL(url), 60_000);
    return blob;
  }
}
