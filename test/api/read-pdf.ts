import { execFile } from 'node:child_process';
import { join } from 'node:path';

export interface PdfReading {
  /** The text of every page, as pdf-parse extracts it. */
  readonly text: string;
  readonly pages: number;
  /** The document information dictionary (Title, Author, Producer, …). */
  readonly info: Record<string, unknown>;
  /** Page 1 rendered by pdf.js at 3 px per pt, PNG (with `{ page1Png: true }`). */
  readonly page1Png?: Buffer;
}

/** `pdf` read back with pdf-parse, in a child Node process (see pdf-parse-child.cjs). */
export function readPdf(pdf: Buffer, options: { page1Png?: boolean } = {}): Promise<PdfReading> {
  const args = [join(__dirname, 'pdf-parse-child.cjs'), ...(options.page1Png ? ['--page-1-png'] : [])];
  return new Promise((resolve, reject) => {
    const child = execFile(process.execPath, args, { maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      if (error) {
        reject(new Error(`pdf-parse could not read the PDF: ${stderr || error.message}`));
        return;
      }
      const reading = JSON.parse(stdout) as Omit<PdfReading, 'page1Png'> & { page1Png?: string };
      resolve({ ...reading, page1Png: reading.page1Png ? Buffer.from(reading.page1Png, 'base64') : undefined });
    });
    child.stdin!.end(pdf);
  });
}
