/**
 * The card code: a short code printed on every issued speed card (and in its QR code), by which
 * anyone holding the card can ask whether the revision it was built from is still current.
 *
 * Form: 8 random characters and 1 check character, 9 in all, printed in groups of three
 * (`K7M-4RT-X9X`). Stored and sent without the dashes.
 *
 * Alphabet (our own): the digits 2–9 and 15 capital letters, 23 characters. Left out are the
 * characters a reader mixes up on a printed or handwritten card: 0 O Q D (round), 1 I L (a
 * stroke), 2/Z, 5/S, 6/G, 8/B, U/V (and V beside W). Typed input is forgiving: case, spaces,
 * dashes and dots do not matter, and Z, S, G, B (never part of a code) are read as 2, 5, 6, 8.
 *
 * Check character: the pure system of ISO/IEC 7064:2003 (the scheme of its MOD 11-2 and
 * MOD 37-2), here with modulus 23 — the size of the alphabet, a prime — and radix 5. For the
 * characters a₁…aₙ and check c, Σ aᵢ·5^(n+1−i) + c ≡ 1 (mod 23). Because 23 is prime and no
 * character value differs from another by a multiple of 23, changing one character changes the
 * sum by w·(a−b) ≢ 0: every single-character error is caught. Swapping two characters i, j
 * changes it by (wᵢ − wⱼ)·(a−b), which is non-zero whenever wᵢ ≢ wⱼ; 5 is a primitive root
 * mod 23, so the 9 weights 5⁰…5⁸ are all different: every transposition (adjacent or not) is
 * caught. The random part: 23⁸ ≈ 7.8·10¹⁰ codes, drawn from the platform's cryptographic
 * random source (Web Crypto, in browsers and Node alike).
 */

// The code's form lives with the card model (shared/card/card-code-form.ts), which the card
// API's schemas read; the card check depends on shared/card, never the other way.
import {
  CARD_CODE_ALPHABET,
  CARD_CODE_LENGTH,
  CARD_CODE_MODULUS,
  CARD_CODE_PATTERN,
  CARD_CODE_RADIX,
  CARD_CODE_RANDOM_LENGTH,
} from '../card/card-code-form';

export { CARD_CODE_ALPHABET, CARD_CODE_LENGTH, CARD_CODE_MODULUS, CARD_CODE_PATTERN, CARD_CODE_RADIX, CARD_CODE_RANDOM_LENGTH };

const VALUE = new Map<string, number>([...CARD_CODE_ALPHABET].map((character, index) => [character, index]));

/** Letters never used in a code that a reader types for the digit they resemble. */
const READ_AS: Record<string, string> = { Z: '2', S: '5', G: '6', B: '8' };
/** Characters never used, with what to say about them. */
const NEVER_USED: Record<string, string> = {
  '0': 'the digit 0',
  O: 'the letter O',
  Q: 'the letter Q',
  D: 'the letter D',
  '1': 'the digit 1',
  I: 'the letter I',
  L: 'the letter L',
  U: 'the letter U',
  V: 'the letter V',
};

/**
 * The check value of ISO/IEC 7064's pure systems: the c in 0…modulus−1 for which
 * Σ aᵢ·radix^(n+1−i) + c ≡ 1 (mod modulus). MOD 11-2 is `(digits, 11, 2)` (10 written X).
 */
export function iso7064PureCheckValue(values: readonly number[], modulus: number, radix: number): number {
  let p = 0;
  for (const value of values) p = ((p + value) * radix) % modulus;
  return (modulus + 1 - p) % modulus;
}

/** The check character for the 8 random characters `body` (alphabet characters only). */
export function cardCodeCheckCharacter(body: string): string {
  const values = [...body].map((character) => {
    const value = VALUE.get(character);
    if (value === undefined) throw new Error(`“${character}” is not a card code character.`);
    return value;
  });
  return CARD_CODE_ALPHABET[iso7064PureCheckValue(values, CARD_CODE_MODULUS, CARD_CODE_RADIX)];
}

/** Fills `bytes` with cryptographically strong random bytes. */
export type RandomBytes = (bytes: Uint8Array) => void;

const webCryptoRandom: RandomBytes = (bytes) => {
  const crypto = (globalThis as { crypto?: { getRandomValues(array: Uint8Array): Uint8Array } }).crypto;
  if (!crypto?.getRandomValues) throw new Error('This platform has no cryptographic random source (Web Crypto).');
  crypto.getRandomValues(bytes);
};

/**
 * A new card code (stored form, no dashes). Each random character is uniform over the
 * alphabet: bytes of 230 and above (10 × 23) are drawn again rather than folded in.
 */
export function generateCardCode(random: RandomBytes = webCryptoRandom): string {
  let body = '';
  const bytes = new Uint8Array(16);
  while (body.length < CARD_CODE_RANDOM_LENGTH) {
    random(bytes);
    for (const byte of bytes) {
      if (byte >= 230 || body.length === CARD_CODE_RANDOM_LENGTH) continue;
      body += CARD_CODE_ALPHABET[byte % CARD_CODE_MODULUS];
    }
  }
  return body + cardCodeCheckCharacter(body);
}

/** A stored code as printed: three groups of three, `K7M-4RT-X9X`. */
export function formatCardCode(code: string): string {
  return code.replace(/(.{3})(?=.)/g, '$1-');
}

/**
 * Typed or scanned text as a stored code would be: capitals, no spaces, dashes, dots or
 * underscores, and Z S G B read as 2 5 6 8. Anything else is kept (for `validateCardCode` to name).
 */
export function normaliseCardCode(input: string): string {
  return input
    .toUpperCase()
    .replace(/[\s\-‐‑‒–—.·_]/g, '')
    .replace(/[ZSGB]/g, (letter) => READ_AS[letter]);
}

export type CardCodeProblem = 'empty' | 'character' | 'length' | 'check';

export type CardCodeValidation =
  | { readonly ok: true; readonly code: string }
  | { readonly ok: false; readonly problem: CardCodeProblem; readonly message: string };

/**
 * Whether `input` (typed, scanned or from a URL) is a card code; if so, its stored form. A
 * failure says in a sentence what is wrong: nothing given, a character no code uses, the
 * wrong number of characters, or a check character that does not fit (a mistyped character).
 */
export function validateCardCode(input: string): CardCodeValidation {
  const code = normaliseCardCode(input);
  if (code.length === 0) return { ok: false, problem: 'empty', message: 'Type the code printed on the card.' };
  for (const character of code) {
    if (VALUE.has(character)) continue;
    const named = NEVER_USED[character] ?? `“${character}”`;
    return {
      ok: false,
      problem: 'character',
      message: `A card code never contains ${named}; it uses only the digits 2 to 9 and the letters ${[...CARD_CODE_ALPHABET.slice(8)].join(' ')}.`,
    };
  }
  if (code.length !== CARD_CODE_LENGTH) {
    return {
      ok: false,
      problem: 'length',
      message: `A card code has ${CARD_CODE_LENGTH} characters (such as K7M-4RT-X9X); this one has ${code.length}.`,
    };
  }
  if (cardCodeCheckCharacter(code.slice(0, CARD_CODE_RANDOM_LENGTH)) !== code[CARD_CODE_RANDOM_LENGTH]) {
    return {
      ok: false,
      problem: 'check',
      message: 'This code’s last character does not fit the others, so one of them is mistyped or misread; compare it with the card again.',
    };
  }
  return { ok: true, code };
}

/** Whether `code` is a stored-form card code with a fitting check character. */
export function isCardCode(code: string): boolean {
  return CARD_CODE_PATTERN.test(code) && cardCodeCheckCharacter(code.slice(0, CARD_CODE_RANDOM_LENGTH)) === code[CARD_CODE_RANDOM_LENGTH];
}
