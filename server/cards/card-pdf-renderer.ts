/**
 * The printed card in Node: pdfmake 0.3's Node build with the card's fonts from
 * node_modules/@fontsource (the same WOFF files the browser gets as app assets), unpacked to
 * SFNT once per process (shared/card-pdf/woff.ts says why) into a private temporary folder:
 * pdfmake's text and the SVG renderer inside it both open fonts by path. pdfmake may read no
 * other local file and fetch no URL (its access policies).
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { inflateSync } from 'node:zlib';
import type { TDocumentDefinitions, TFontDictionary } from 'pdfmake/interfaces';
import { cardFontDictionary, cardFontFiles, type CardFontFile } from '@shared/card-pdf/fonts';
import { woffToSfnt } from '@shared/card-pdf/woff';

type PdfMake = typeof import('pdfmake');

/** The path of a shipped font file. */
export function fontPath(font: CardFontFile): string {
  return join(dirname(require.resolve(`${font.fontsourcePackage}/package.json`)), 'files', font.file);
}

async function load(): Promise<PdfMake> {
  const folder = mkdtempSync(join(tmpdir(), 'speedwright-card-fonts-'));
  process.once('exit', () => rmSync(folder, { recursive: true, force: true }));
  const paths = new Map<string, string>();
  for (const font of cardFontFiles()) {
    const sfnt = await woffToSfnt(readFileSync(fontPath(font)), (data) => inflateSync(data));
    const path = join(folder, font.file.replace(/\.woff$/, '.ttf'));
    writeFileSync(path, sfnt);
    paths.set(font.file, path);
  }
  const allowed = new Set([...paths.values()].map((path) => resolve(path)));
  // The Node build is a CommonJS instance whose methods live on its prototype.
  const instance = require('pdfmake') as PdfMake;
  instance.setFonts(cardFontDictionary((font) => paths.get(font.file)!) as TFontDictionary);
  instance.setLocalAccessPolicy((path) => allowed.has(resolve(path)));
  instance.setUrlAccessPolicy(() => false);
  return instance;
}

let loading: Promise<PdfMake> | null = null;

/** The PDF of `definition` (a fresh definition: pdfmake writes into it while laying out). */
export async function renderCardPdf(definition: TDocumentDefinitions): Promise<Buffer> {
  loading ??= load();
  const pdfmake = await loading;
  const output = pdfmake.createPdf(definition) as unknown as { getBuffer(): Promise<Buffer> };
  return output.getBuffer();
}
