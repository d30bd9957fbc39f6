import { execFile } from 'node:child_process';
import { join } from 'node:path';

export interface PdfReading {
  /** The text of every page, as pdf-parse extracts it. */
  readonly text: string;
  readonly pages: number;
  /** The document information dictionary (Title, Author, Producer, …). */
  readonly info: Record<string, unknown>;
}

/** `pdf` read back with pdf-parse, in a child Node process (see pdf-parse-child.cjs). */
export function readPdf(pdf: Buffer): Promise<PdfReading> {
  return new Promise((resolve, reject) => {
    const child = execFile(process.execPath, [join(__dirname, 'pdf-parse-child.cjs')], { maxBuffer: 32 * 1024 * 1024 }, (error, stdout, stderr) => {
      if (error) reject(new Error(`pdf-parse could not read the PDF: ${stderr || error.message}`));
      else resolve(JSON.parse(stdout) as PdfReading);
    });
    child.stdin!.end(pdf);
  });
}
