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

  it('reads a template’s mat-icon elements: their text and the strings of their interpolation, nothing else', () => {
    const words = candidatesIn(`<p role="region" class="note">plain</p> <mat-icon class="ab">delete</mat-icon> <mat-icon>{{ on() ? 'wifi' : 'wifi_off' }}</mat-icon> <mat-icon>{{ name }}</mat-icon>`, 'html');
    expect([...words].sort()).toEqual(['delete', 'wifi', 'wifi_off']);
  });

  it('reads every string literal of a TypeScript file that mentions icons, and none of one that does not', () => {
    expect([...candidatesIn(`const ICONS = { ok: 'check_circle' }; x = "menu_open"; 'Not a name'; 'two words'`, 'ts')].sort()).toEqual(['check_circle', 'menu_open']);
    expect([...candidatesIn('template: `\n  <mat-icon>campaign</mat-icon>\n`', 'ts')]).toEqual(['campaign']);
    expect([...candidatesIn(`const kind = 'takeoff'; mode = "night"`, 'ts')]).toEqual([]);
  });
});
