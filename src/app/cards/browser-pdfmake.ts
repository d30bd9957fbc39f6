/**
 * pdfmake in the browser with the printed card's fonts, framework-free (the card printer and
 * the Chromium benchmark both use it). pdfmake's browser build is imported dynamically, so it is
 * a chunk of its own; the fonts are fetched from the app's `/pdf-fonts/` assets (prefetched by
 * the service worker, so this works offline) and unpacked once from WOFF (shared/card-pdf/woff.ts).
 */
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { BROWSER_FONT_PATH, cardFontDictionary, cardFontFiles, type CardFontFile } from '@shared/card-pdf/fonts';
import { woffToSfnt } from '@shared/card-pdf/woff';

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

let loading: Promise<PdfMake> | null = null;

/** pdfmake with the card's fonts; the first call loads both, later calls reuse them. */
export function loadPdfMake(fontBase = BROWSER_FONT_PATH): Promise<PdfMake> {
  loading ??= (async () => {
    const pdfMake = (await import('pdfmake/build/pdfmake')).default as unknown as PdfMake;
    const vfs: Record<string, string> = {};
    await Promise.all(
      cardFontFiles().map(async (font) => {
        let response: Response;
        try {
          response = await fetch(`${fontBase}${font.file}`);
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
  loading.catch(() => (loading = null));
  return loading;
}

/** The PDF of `definition` (a fresh one: pdfmake writes into it). */
export async function renderPdfInBrowser(definition: TDocumentDefinitions): Promise<Blob> {
  const pdfMake = await loadPdfMake();
  const output = pdfMake.createPdf(definition) as unknown as { getBlob(): Promise<Blob> };
  return output.getBlob();
}
