/**
 * Frozen copy, for migration 20261202-0701 alone, of the card code generator as it stood when
 * that migration was written (live code: shared/card-check/card-code.ts). A migration must give
 * the same result whenever it runs, so it never imports live code; change this file never.
 *
 * A code: 8 characters drawn uniformly from a 23-character alphabet (bytes of 230 and above are
 * drawn again), then 1 check character of the ISO/IEC 7064:2003 pure system with modulus 23 and
 * radix 5 (Σ aᵢ·5^(n+1−i) + c ≡ 1 mod 23).
 */
import { randomFillSync } from 'node:crypto';

const ALPHABET = '23456789ACEFHJKMNPRTWXY';
const RANDOM_LENGTH = 8;
const MODULUS = 23;
const RADIX = 5;

/** The check character of the 8 random characters `body` (ISO/IEC 7064 pure system). */
export function cardCodeCheckCharacter0701(body: string): string {
  let p = 0;
  for (const character of body) {
    const value = ALPHABET.indexOf(character);
    if (value < 0) throw new Error(`“${character}” is not a card code character.`);
    p = ((p + value) * RADIX) % MODULUS;
  }
  return ALPHABET[(MODULUS + 1 - p) % MODULUS];
}

/** A new card code (stored form, 9 characters, no dashes). */
export function generateCardCode0701(random: (bytes: Uint8Array) => void = randomFillSync): string {
  let body = '';
  const bytes = new Uint8Array(16);
  while (body.length < RANDOM_LENGTH) {
    random(bytes);
    for (const byte of bytes) {
      if (byte >= 230 || body.length === RANDOM_LENGTH) continue;
      body += ALPHABET[byte % MODULUS];
    }
  }
  return body + cardCodeCheckCharacter0701(body);
}
