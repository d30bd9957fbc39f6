import { cardCodeCheckCharacter, generateCardCode, isCardCode } from '@shared/card-check/card-code';
import { cardCodeCheckCharacter0701, generateCardCode0701 } from './card-code-0701';

/** A repeatable byte source: a linear congruential generator (Numerical Recipes' constants, from memory). */
function bytesFrom(seed: number): (bytes: Uint8Array) => void {
  let state = seed >>> 0;
  return (bytes) => {
    for (let i = 0; i < bytes.length; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      bytes[i] = state >>> 24;
    }
  };
}

describe('the card code generator frozen for migration 20261202-0701', () => {
  // Holds while the live generator draws as it did in 0701; should the live one ever change,
  // drop this case — never change the frozen copy.
  it('draws the same codes as the live generator from the same bytes (frozen when they agreed)', () => {
    for (let seed = 1; seed <= 200; seed++) {
      expect(generateCardCode0701(bytesFrom(seed))).toBe(generateCardCode(bytesFrom(seed)));
    }
  });

  it('writes codes the live check accepts (ISO/IEC 7064:2003 pure system, modulus 23, radix 5)', () => {
    for (let i = 0; i < 200; i++) expect(isCardCode(generateCardCode0701())).toBe(true);
  });

  it('computes the check character as the live code does, and refuses a character outside the alphabet', () => {
    for (const body of ['22222222', 'YYYYYYYY', 'K7M4RTX9', 'ACEFHJKM']) {
      expect(cardCodeCheckCharacter0701(body)).toBe(cardCodeCheckCharacter(body));
    }
    expect(() => cardCodeCheckCharacter0701('K7M4RT0X')).toThrow('not a card code character');
  });
});
