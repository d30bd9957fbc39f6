import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { cardFontFiles } from './fonts';
import { woffToSfnt } from './woff';

// fontkit (the font library pdfkit uses) reads both WOFF and TrueType: the unpacked font must be
// the same font to it — same glyphs, metrics and names — as the WOFF file it came from.
const fontkit = require('fontkit') as { create(buffer: Buffer): FontkitFont };
interface FontkitFont {
  type: string;
  postscriptName: string;
  numGlyphs: number;
  unitsPerEm: number;
  ascent: number;
  descent: number;
  layout(text: string): { advanceWidth: number; glyphs: { id: number }[] };
}

const fileOf = (pkg: string, file: string) => join(dirname(require.resolve(`${pkg}/package.json`)), 'files', file);

describe('WOFF to SFNT', () => {
  it.each(cardFontFiles().map((font) => [font.file, font] as const))('unpacks %s to the same font, as fontkit reads it', async (_name, font) => {
    const woff = readFileSync(fileOf(font.fontsourcePackage, font.file));
    const sfnt = Buffer.from(await woffToSfnt(woff, (data) => inflateSync(data)));
    const fromWoff = fontkit.create(woff);
    const fromSfnt = fontkit.create(sfnt);
    expect(fromWoff.type).toBe('WOFF');
    expect(fromSfnt.type).toBe('TTF');
    for (const key of ['postscriptName', 'numGlyphs', 'unitsPerEm', 'ascent', 'descent'] as const) expect(fromSfnt[key]).toEqual(fromWoff[key]);
    const text = 'ZZ-KFJ 0123456789 kt °C – VREF';
    expect(fromSfnt.layout(text).advanceWidth).toBe(fromWoff.layout(text).advanceWidth);
    expect(fromSfnt.layout(text).glyphs.map((glyph) => glyph.id)).toEqual(fromWoff.layout(text).glyphs.map((glyph) => glyph.id));
    // SFNT's "true" / 0x00010000 TrueType tag (OpenType spec, table directory).
    expect(sfnt.readUInt32BE(0)).toBe(0x00010000);
  });

  it('refuses what is not a WOFF file', async () => {
    await expect(woffToSfnt(new Uint8Array(60), (data) => data)).rejects.toThrow('Not a WOFF 1.0 font file.');
  });
});
