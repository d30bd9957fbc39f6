import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { candidatesIn, iconCandidates } from '../../tools/icon-candidates';

/**
 * The subset icon font (tools/subset-icon-font.ts) must know every word of the sources that
 * may name an icon; a new icon name in a template or a string shows as letters until
 * `npm run icons` has added its glyph.
 */
const root = join(__dirname, '..', '..');
const manifest = JSON.parse(readFileSync(join(__dirname, 'icon-font-manifest.json'), 'utf8')) as {
  subsetSha256: string;
  icons: Record<string, { codePoint: string }>;
  otherWords: string[];
};

describe('the subset icon font', () => {
  it('has been made from the current sources: every candidate word was checked against the full font', () => {
    const known = new Set([...Object.keys(manifest.icons), ...manifest.otherWords]);
    const unchecked = [...iconCandidates(root)].filter(([word]) => !known.has(word)).map(([word, file]) => `${word} (${file})`);
    expect(unchecked).toEqual([]);
  });

  it('is the file the manifest describes, in WOFF2', () => {
    const font = readFileSync(join(__dirname, 'material-symbols-subset.woff2'));
    expect(font.subarray(0, 4).toString('latin1')).toBe('wOF2'); // WOFF2 signature (W3C WOFF 2.0, 5.1)
    expect(createHash('sha256').update(font).digest('hex')).toBe(manifest.subsetSha256);
  });

  it('holds the shell’s icons and every navigation icon', () => {
    for (const name of ['menu', 'menu_open', 'logout', 'info', 'wifi', 'wifi_off', 'light_mode', 'dark_mode', 'visibility', 'visibility_off', 'home', 'speed', 'flight', 'qr_code_scanner']) {
      expect(manifest.icons[name]).toBeDefined();
    }
  });

  it('finds names in string literals and in the text of mat-icon elements, not in interpolations', () => {
    const words = candidatesIn(`icon: 'flight', x = "menu_open"; <mat-icon class="a">delete</mat-icon> <mat-icon>{{ name }}</mat-icon> 'Not a name' 'two words'`);
    expect([...words].sort()).toEqual(['delete', 'flight', 'menu_open']);
  });
});
