/**
 * The words of the app's sources that may name an icon of the Material Symbols font, when they
 * look like a ligature name (lower case, digits and underscores):
 * - in templates (`.html`), what a `<mat-icon>` element holds: its text, or the quoted strings
 *   of its interpolation (`{{ online() ? 'wifi' : 'wifi_off' }}`);
 * - in TypeScript files that mention icons at all (`icon: 'flight'`, maps of statuses to
 *   icons), every one-line string literal, and their inline templates as above.
 * Which of them really are icons only the font can say (tools/subset-icon-font.ts shapes each
 * one); the test beside the subset font checks that none was left unchecked.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

/** Folders whose files can name an icon shown by the app. */
export const ICON_SOURCE_DIRS = ['src/app', 'shared'];

const LIGATURE_NAME = /^[a-z][a-z0-9_]{1,39}$/;
const STRING_LITERAL = /'([^'\\\n]*)'|"([^"\\\n]*)"|`([^`\\$\n]*)`/g;
const MAT_ICON_CONTENT = /<mat-icon\b[^>]*>([^<]*)<\/mat-icon>/g;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return /\.(ts|html)$/.test(entry.name) && !/\.(spec|test|bench|e2e)\.ts$/.test(entry.name) ? [path] : [];
  });
}

/** The candidate words of one file's text; `kind` says how it is read (see above). */
export function candidatesIn(text: string, kind: 'html' | 'ts'): Set<string> {
  const words = new Set<string>();
  const consider = (value: string | undefined) => {
    const word = value?.trim();
    if (word && LIGATURE_NAME.test(word)) words.add(word);
  };
  const literalsOf = (part: string) => {
    for (const match of part.matchAll(STRING_LITERAL)) consider(match[1] ?? match[2] ?? match[3]);
  };
  if (kind === 'ts' && /icon/i.test(text)) literalsOf(text);
  // Templates, and the inline templates of components (multi-line strings the literals miss).
  for (const match of text.matchAll(MAT_ICON_CONTENT)) {
    const content = match[1]!;
    if (content.includes('{{')) literalsOf(content);
    else consider(content);
  }
  return words;
}

/** Every candidate word of the app's sources, sorted, with one file that uses it. */
export function iconCandidates(root: string): Map<string, string> {
  const found = new Map<string, string>();
  for (const dir of ICON_SOURCE_DIRS) {
    for (const file of sourceFiles(join(root, dir)).sort()) {
      for (const word of candidatesIn(readFileSync(file, 'utf8'), file.endsWith('.html') ? 'html' : 'ts')) {
        if (!found.has(word)) found.set(word, relative(root, file));
      }
    }
  }
  return new Map([...found].sort(([a], [b]) => a.localeCompare(b)));
}
