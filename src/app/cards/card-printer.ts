import { DOCUMENT } from '@angular/common';
import { Injectable, inject } from '@angular/core';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { renderPdfInBrowser } from './browser-pdfmake';

export { CardPrintError } from './browser-pdfmake';

/**
 * Makes the printed card's PDF on this device and hands it to the browser as a download.
 * pdfmake and the fonts load on the first print (browser-pdfmake.ts), so printing works offline.
 */
@Injectable({ providedIn: 'root' })
export class CardPrinter {
  private readonly document = inject(DOCUMENT);

  async download(definition: TDocumentDefinitions, fileName: string): Promise<Blob> {
    const blob = await renderPdfInBrowser(definition);
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
