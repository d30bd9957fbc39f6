import * as z from 'zod';
import { createAirframeSchema, createAircraftTypeSchema } from '../api/fleet';
import { invitePersonRequestSchema } from '../api/auth';
import { createSpeedBookSchema, reasonSchema } from '../api/revisions';
import { forbiddenCharacterIn, plainText, withoutForbiddenCharacters } from './plain-text';

// The characters come from the Unicode Standard: general category Cc (controls), UAX #9's
// explicit directional formatting characters, and UTF-16's surrogate range (D800–DFFF).
const REFUSED: [string, string][] = [
  ['NUL', '\u0000'],
  ['BEL', '\u0007'],
  ['CR', '\r'],
  ['LF', '\n'],
  ['ESC', '\u001B'],
  ['DEL', '\u007F'],
  ['C1 NEL', '\u0085'],
  ['RLO', '\u202E'],
  ['LRE', '\u202A'],
  ['RLI', '\u2067'],
  ['PDI', '\u2069'],
  ['RLM', '\u200F'],
  ['ALM', '\u061C'],
  ['line separator', '\u2028'],
  ['lone high surrogate', '\uD83D'],
  ['lone low surrogate', '\uDE00'],
];

describe('forbiddenCharacterIn', () => {
  it.each(REFUSED)('names %s inside a single line', (_name, character) => {
    expect(forbiddenCharacterIn(`Kestrel${character}Fen`)).toMatch(/U\+[0-9A-F]{4}/);
  });

  it('accepts accented letters, other scripts, emoji pairs and ordinary punctuation', () => {
    for (const text of ['Zoë Ångström', 'مطار', '飞行员', 'Pilot ✈️ 🛩️', 'O’Brien – “Chief”', 'ZZ-KFA', '']) {
      expect(forbiddenCharacterIn(text)).toBeNull();
    }
  });

  it('lets multi-line text keep line breaks and tabs but nothing else', () => {
    expect(forbiddenCharacterIn('First line\r\nsecond\tline', 'multi-line')).toBeNull();
    expect(forbiddenCharacterIn('bell\u0007', 'multi-line')).toBe('an invisible control character (U+0007)');
    expect(forbiddenCharacterIn('abc\u202Edef', 'multi-line')).toBe('a direction control (U+202E)');
    expect(forbiddenCharacterIn('half \uD800', 'multi-line')).toBe('a broken character (U+D800, half of a pair)');
  });

  it('describes a line break as one', () => {
    expect(forbiddenCharacterIn('a\nb')).toBe('a line break (U+000A)');
  });
});

describe('plainText in the shared schemas', () => {
  const firstIssue = (schema: z.ZodType, value: unknown) => {
    const result = schema.safeParse(value);
    expect(result.success).toBe(false);
    return result.error!.issues[0]!;
  };

  it('refuses a direction override in a person’s name with a field message', () => {
    const issue = firstIssue(invitePersonRequestSchema, { email: 'a@b.example', displayName: 'Ann\u202Egnirts', role: 'pilot' });
    expect(issue.path).toEqual(['displayName']);
    expect(issue.message).toBe('The name may not contain a direction control (U+202E); type it again without it.');
  });

  it('refuses a line break at the end of a serial instead of trimming it away', () => {
    const issue = firstIssue(createAirframeSchema, { registration: 'ZZ-KFA', serial: 'S-1001\n', aircraftTypeId: 1 });
    expect(issue.path).toEqual(['serial']);
  });

  it('refuses a NUL in a registration, a BEL in a type name and a lone surrogate in a book title', () => {
    expect(firstIssue(createAirframeSchema, { registration: 'ZZ-K\u0000A', serial: 'S1', aircraftTypeId: 1 }).path).toEqual(['registration']);
    expect(
      firstIssue(createAircraftTypeSchema, { designator: 'ZZP1', name: 'Trainer\u0007', category: 'jet', engines: 2, ceilingFt: 41000 }).path,
    ).toEqual(['name']);
    expect(firstIssue(createSpeedBookSchema, { aircraftTypeId: 1, title: 'Book \uD83D' }).path).toEqual(['title']);
  });

  it('keeps a multi-line reason’s line breaks', () => {
    expect(reasonSchema.parse({ reason: 'Figures differ.\nSee AFM 5-3.' }).reason).toBe('Figures differ.\nSee AFM 5-3.');
  });

  it('works as a check on any string schema', () => {
    expect(z.string().check(plainText('It')).safeParse('ok').success).toBe(true);
  });
});

describe('withoutForbiddenCharacters', () => {
  it('removes what the check would name and keeps the rest', () => {
    expect(withoutForbiddenCharacters('AFM\u202E fdp.\u0000page\uD800 ✈️.pdf')).toBe('AFM fdp.page ✈️.pdf');
  });
});
