/**
 * Characters a name, registration, serial, title or other line of text typed by a person may not
 * hold: they do not print, they reorder what is printed around them, or they are not text at all.
 *
 * - C0 and C1 controls and DEL (Unicode general category Cc: NUL, BEL, CR, LF, ESC …), which a
 *   log line, a CSV export or a terminal would act on. Multi-line fields keep LF, CR and TAB.
 * - Bidirectional formatting characters (Unicode Standard Annex #9, "Explicit Directional
 *   Formatting" and "Implicit Directional Marks": U+061C, U+200E, U+200F, U+202A–U+202E,
 *   U+2066–U+2069), which can make "ZZ-KFA" read as another registration on screen or paper
 *   (the "Trojan Source" class, CVE-2021-42574).
 * - Line and paragraph separators (U+2028, U+2029) in single-line fields.
 * - Lone surrogates (a UTF-16 half with no partner), which are not Unicode text and which
 *   MariaDB's utf8mb4 stores as "?".
 *
 * One helper for every shared zod schema, so the form and the server refuse the same text.
 */
import * as z from 'zod/mini';

const BIDI_CONTROLS = '\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069';

const SINGLE_LINE_FORBIDDEN = new RegExp(`[\\p{Cc}\\u2028\\u2029${BIDI_CONTROLS}]|\\p{Cs}`, 'u');
/** As above, but line feeds, carriage returns and tabs are part of multi-line text. */
const MULTI_LINE_FORBIDDEN = new RegExp(`[\\u0000-\\u0008\\u000B\\u000C\\u000E-\\u001F\\u007F-\\u009F${BIDI_CONTROLS}]|\\p{Cs}`, 'u');

export type TextKind = 'single-line' | 'multi-line';

/**
 * The first character `text` may not hold, described for a person ("a line break", "U+202E, a
 * direction override"), or null when the text is clean.
 *
 * @example forbiddenCharacterIn('ZZ-K\u202EFA', 'single-line') // 'a direction control (U+202E)'
 */
export function forbiddenCharacterIn(text: string, kind: TextKind = 'single-line'): string | null {
  const match = (kind === 'single-line' ? SINGLE_LINE_FORBIDDEN : MULTI_LINE_FORBIDDEN).exec(text);
  if (!match) return null;
  return describe(match[0]);
}

function describe(character: string): string {
  const codePoint = character.codePointAt(0) ?? 0;
  const hex = `U+${codePoint.toString(16).toUpperCase().padStart(4, '0')}`;
  if (codePoint >= 0xd800 && codePoint <= 0xdfff) return `a broken character (${hex}, half of a pair)`;
  if (character === '\n' || character === '\r' || character === '\u2028' || character === '\u2029') return `a line break (${hex})`;
  if (character === '\t') return `a tab (${hex})`;
  if (new RegExp(`[${BIDI_CONTROLS}]`, 'u').test(character)) return `a direction control (${hex})`;
  return `an invisible control character (${hex})`;
}

/** The sentence a field shows for `text`, or null. */
export function plainTextProblem(what: string, text: string, kind: TextKind = 'single-line'): string | null {
  const found = forbiddenCharacterIn(text, kind);
  return found ? `${what} may not contain ${found}; type it again without it.` : null;
}

/**
 * A zod check refusing what `forbiddenCharacterIn` finds, with a field message. Chain it first,
 * before `.trim()`, so a line break at either end is refused rather than silently cut:
 * `z.string().check(plainText('The name')).trim()`. Made with `zod/mini` (a check of zod's core),
 * so it serves schemas of either build: the speed book's content (small build) and the API's.
 */
export function plainText(what: string, kind: TextKind = 'single-line') {
  return z.superRefine<string>((text, context) => {
    const problem = plainTextProblem(what, text, kind);
    if (problem) context.addIssue({ code: 'custom', message: problem, input: text });
  });
}

/**
 * `text` with every character `forbiddenCharacterIn` would name removed, for names nobody typed
 * in a form (an uploaded file's name): those are cleaned, not refused.
 */
export function withoutForbiddenCharacters(text: string): string {
  return text.replace(new RegExp(SINGLE_LINE_FORBIDDEN.source, 'gu'), '');
}
