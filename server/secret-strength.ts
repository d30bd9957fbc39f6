/**
 * Whether a server secret (SESSION_SECRET, SIGNING_KEY_SECRET) is fit for production, checked
 * once at start by `loadConfig`. Not a proof of randomness (no test of a single string can be);
 * it refuses what people actually type instead of generating a secret: short values, values
 * published with Speedwright, placeholders, one character or a short piece repeated, runs along
 * the keyboard's digits or letters, and strings whose characters are too few or too uneven to
 * carry 96 bits by a Shannon estimate (Shannon 1948: −Σ p·log2 p over the string's own
 * character frequencies, times its length).
 *
 * What passes easily: `openssl rand -base64 32` (44 characters, about 200 bits by the estimate)
 * or `openssl rand -hex 32` (64 characters, about 240). The thresholds leave such values a
 * chance of refusal of a few in a million (a repeated 7-character piece in 64 random hex
 * digits: about 58²/2 / 16⁷ ≈ 6·10⁻⁶; measured: none in 50,000 of each); the refusal says
 * why, and a second draw passes. Common practice for sanity checks of this kind.
 */

export const MIN_SECRET_LENGTH = 32;
export const MIN_SECRET_ESTIMATED_BITS = 96;
export const MIN_SECRET_DISTINCT_CHARACTERS = 10;
/** Length of a run (`aaaaaaa`, `abcdefg`, `7654321`) or of a piece that may not occur twice. */
export const SECRET_PATTERN_LENGTH = 7;

/**
 * Values published in this repository — the tests', the benchmarks' and the documentation's
 * examples — which therefore are not secret anywhere. `server/secret-strength.spec.ts` checks
 * that the tests' constants are listed.
 */
export const PUBLISHED_SECRETS: readonly string[] = [
  'test-session-secret-that-is-long-enough-0123456789',
  'test-signing-key-secret-that-is-long-enough-0123',
  'bench-session-secret-that-is-long-enough-0123456789',
  'bench-signing-key-secret-0123456789-abcdefghij',
];

/** Words that mark a value as a placeholder someone forgot to replace. */
const PLACEHOLDER_WORDS = ['changeme', 'change-me', 'change_me', 'replace', 'example', 'placeholder', 'password', 'speedwright'];

/** The Shannon estimate of the string's information in bits (see the file's comment). */
export function estimatedSecretBits(value: string): number {
  const characters = [...value];
  const counts = new Map<string, number>();
  for (const character of characters) counts.set(character, (counts.get(character) ?? 0) + 1);
  let bitsPerCharacter = 0;
  for (const count of counts.values()) {
    const p = count / characters.length;
    bitsPerCharacter -= p * Math.log2(p);
  }
  return bitsPerCharacter * characters.length;
}

/** A stretch of SECRET_PATTERN_LENGTH characters that is one character, or climbs or falls by one code point each step. */
function runOf(characters: string[]): string | undefined {
  for (let start = 0; start + SECRET_PATTERN_LENGTH <= characters.length; start++) {
    const codes = characters.slice(start, start + SECRET_PATTERN_LENGTH).map((character) => character.codePointAt(0)!);
    for (const step of [0, 1, -1]) {
      if (codes.every((code, i) => i === 0 || code - codes[i - 1]! === step)) return characters.slice(start, start + SECRET_PATTERN_LENGTH).join('');
    }
  }
  return undefined;
}

/** A piece of SECRET_PATTERN_LENGTH characters that occurs twice (overlaps count). */
function repeatedPiece(characters: string[]): string | undefined {
  const seen = new Set<string>();
  for (let start = 0; start + SECRET_PATTERN_LENGTH <= characters.length; start++) {
    const piece = characters.slice(start, start + SECRET_PATTERN_LENGTH).join('');
    if (seen.has(piece)) return piece;
    seen.add(piece);
  }
  return undefined;
}

/**
 * Why `value` is not a usable secret, as the end of a sentence that starts with the variable's
 * name ("SESSION_SECRET is shorter than 32 characters"), or `null` when it passes.
 */
export function secretWeakness(value: string): string | null {
  const characters = [...value];
  if (characters.length < MIN_SECRET_LENGTH) return `is shorter than ${MIN_SECRET_LENGTH} characters`;
  if (PUBLISHED_SECRETS.includes(value)) return 'is a value published with Speedwright (in its tests or documentation), so it is not secret';
  const lower = value.toLowerCase();
  const placeholder = PLACEHOLDER_WORDS.find((word) => lower.includes(word));
  if (placeholder) return `contains "${placeholder}", which marks a placeholder rather than a secret`;
  const distinct = new Set(characters).size;
  if (distinct < MIN_SECRET_DISTINCT_CHARACTERS) return `uses only ${distinct} different characters (at least ${MIN_SECRET_DISTINCT_CHARACTERS} needed)`;
  const run = runOf(characters);
  if (run) return `contains the run "${run}"`;
  const piece = repeatedPiece(characters);
  if (piece) return `repeats "${piece}"`;
  const bits = estimatedSecretBits(value);
  if (bits < MIN_SECRET_ESTIMATED_BITS) return `carries about ${Math.floor(bits)} bits by its character frequencies (at least ${MIN_SECRET_ESTIMATED_BITS} needed)`;
  return null;
}
