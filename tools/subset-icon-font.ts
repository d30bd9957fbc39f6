/**
 * `npm run icons`: writes the app's icon font, `src/fonts/material-symbols-subset.woff2`, with
 * only the Material Symbols (Outlined, weight 400) the app names, and its manifest
 * `src/fonts/icon-font-manifest.json`. Run it after using an icon the font does not have yet;
 * `src/fonts/icon-font.spec.ts` fails until then.
 *
 * Method: the full font from @fontsource/material-symbols-outlined (325 KB) maps each icon to
 * a private-use code point and, through its GSUB ligatures (OpenType `liga`), to the letters
 * of its name. Each candidate word of the sources (tools/icon-candidates.ts) is shaped with
 * HarfBuzz; a word is an icon when it shapes to one glyph that has a private-use code point.
 * The subset keeps the letters of the names and those code points, without HarfBuzz's layout
 * closure (`hb-subset --no-layout-closure`): otherwise the letters would pull in every
 * ligature, that is every icon. The ligatures whose glyphs are all kept stay, so templates
 * keep writing `<mat-icon>flight</mat-icon>`.
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { dirname, join } from 'node:path';
import { iconCandidates } from './icon-candidates';

const root = join(__dirname, '..');
const SOURCE_FONT = join(root, 'node_modules/@fontsource/material-symbols-outlined/files/material-symbols-outlined-latin-400-normal.woff2');
export const SUBSET_FONT = join(root, 'src/fonts/material-symbols-subset.woff2');
export const MANIFEST = join(root, 'src/fonts/icon-font-manifest.json');
const PRIVATE_USE_FIRST = 0xe000;

async function main(): Promise<void> {
  // Both ship as ES modules (harfbuzzjs with top-level await) or CommonJS without types.
  const hb = await import('harfbuzzjs');
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const fontverter = require('fontverter') as { convert(buffer: Buffer, format: 'sfnt' | 'woff2'): Promise<Buffer> };
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const subsetFont = require('subset-font') as (font: Buffer, text: string, options: Record<string, unknown>) => Promise<Buffer>;

  const original = readFileSync(SOURCE_FONT);
  const sfnt = await fontverter.convert(original, 'sfnt');
  const face = new hb.Face(new hb.Blob(sfnt));
  const font = new hb.Font(face);
  const glyphsOf = (text: string): number[] => {
    const buffer = new hb.Buffer();
    buffer.addText(text);
    buffer.guessSegmentProperties();
    hb.shape(font, buffer);
    return buffer.getGlyphInfos().map((info) => info.codepoint);
  };

  // Glyph → its private-use code point.
  const codePointOfGlyph = new Map<number, number>();
  for (const codePoint of Array.from(face.collectUnicodes())) {
    if (codePoint < PRIVATE_USE_FIRST) continue;
    const [glyph] = glyphsOf(String.fromCodePoint(codePoint));
    if (glyph) codePointOfGlyph.set(glyph, codePoint);
  }

  const icons: Record<string, { codePoint: string; usedIn: string }> = {};
  const otherWords: string[] = [];
  for (const [word, file] of iconCandidates(root)) {
    const glyphs = glyphsOf(word);
    const codePoint = glyphs.length === 1 ? codePointOfGlyph.get(glyphs[0]!) : undefined;
    if (codePoint === undefined) otherWords.push(word);
    else icons[word] = { codePoint: codePoint.toString(16), usedIn: file };
  }
  const names = Object.keys(icons);
  const letters = [...new Set(names.join(''))].sort().join('');
  const codePoints = names.map((name) => String.fromCodePoint(parseInt(icons[name]!.codePoint, 16))).join('');
  const subset = await subsetFont(original, letters + codePoints, { targetFormat: 'woff2', noLayoutClosure: true });

  // Check the subset: every name still shapes to its one glyph, and nothing else got in.
  const subsetFace = new hb.Face(new hb.Blob(await fontverter.convert(subset, 'sfnt')));
  const subsetFontObject = new hb.Font(subsetFace);
  for (const name of names) {
    const buffer = new hb.Buffer();
    buffer.addText(name);
    buffer.guessSegmentProperties();
    hb.shape(subsetFontObject, buffer);
    if (buffer.getLength() !== 1) throw new Error(`The subset lost the ligature of "${name}".`);
  }

  mkdirSync(dirname(SUBSET_FONT), { recursive: true });
  writeFileSync(SUBSET_FONT, subset);
  const manifest = {
    comment: 'Written by `npm run icons` (tools/subset-icon-font.ts); do not edit.',
    sourceFont: '@fontsource/material-symbols-outlined ' + (JSON.parse(readFileSync(join(root, 'node_modules/@fontsource/material-symbols-outlined/package.json'), 'utf8')) as { version: string }).version + ', latin 400',
    subsetSha256: createHash('sha256').update(subset).digest('hex'),
    icons,
    otherWords,
  };
  writeFileSync(MANIFEST, JSON.stringify(manifest, null, 2) + '\n');
  console.log(`${names.length} icons, ${otherWords.length} other words; ${(original.length / 1000).toFixed(1)} KB → ${(subset.length / 1000).toFixed(1)} KB (${SUBSET_FONT})`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
