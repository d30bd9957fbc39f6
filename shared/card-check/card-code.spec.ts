/**
 * The card code and its check character. The check scheme is the pure system of ISO/IEC
 * 7064:2003; the generic routine is checked against the published MOD 11-2 examples of the
 * ORCID identifier (ORCID, "Structure of the ORCID Identifier", support.orcid.org — from
 * memory), then our MOD 23-5 is checked to catch every single-character error and every
 * transposition by trying them all on generated codes.
 */
import fc from 'fast-check';
import {
  CARD_CODE_ALPHABET,
  CARD_CODE_LENGTH,
  cardCodeCheckCharacter,
  formatCardCode,
  generateCardCode,
  isCardCode,
  iso7064PureCheckValue,
  normaliseCardCode,
  validateCardCode,
} from './card-code';

/** ORCID's check digit by ISO/IEC 7064 MOD 11-2: the value 10 is written X. */
const orcidCheck = (digits: string) => {
  const value = iso7064PureCheckValue([...digits].map(Number), 11, 2);
  return value === 10 ? 'X' : String(value);
};

describe('ISO/IEC 7064 pure system (the routine under the card code)', () => {
  it.each([
    // ORCID's documented examples (from memory): 0000-0002-1825-0097, 0000-0001-5109-3700, 0000-0002-1694-233X.
    ['000000021825009', '7'],
    ['000000015109370', '0'],
    ['000000021694233', 'X'],
  ])('MOD 11-2 of %s is %s (ORCID examples)', (digits, check) => {
    expect(orcidCheck(digits)).toBe(check);
  });
});

describe('the alphabet', () => {
  it('has 23 distinct characters (a prime, the modulus) and none of the look-alikes', () => {
    expect(new Set(CARD_CODE_ALPHABET).size).toBe(23);
    expect(CARD_CODE_ALPHABET).toHaveLength(23);
    for (const lookAlike of '0OQD1IL2Z5S6G8BUV'.replace(/[2568]/g, '')) expect(CARD_CODE_ALPHABET).not.toContain(lookAlike);
  });
});

/** A source of random bytes from fast-check, so the generator can be driven. */
const bytesFrom = (stream: number[]) => {
  let i = 0;
  return (bytes: Uint8Array) => {
    for (let k = 0; k < bytes.length; k++) bytes[k] = stream[i++ % stream.length];
  };
};

describe('generateCardCode', () => {
  it('gives 9 alphabet characters whose last is the check character', () => {
    for (let i = 0; i < 200; i++) {
      const code = generateCardCode();
      expect(code).toMatch(new RegExp(`^[${CARD_CODE_ALPHABET}]{9}$`));
      expect(code[8]).toBe(cardCodeCheckCharacter(code.slice(0, 8)));
      expect(isCardCode(code)).toBe(true);
    }
  });

  it('draws again for bytes of 230 and above, so every character is equally likely', () => {
    // 229 % 23 = 22 (Y); 230 would fold to 0 and favour the first characters: it is skipped.
    const code = generateCardCode(bytesFrom([230, 255, 229, 0, 23, 46, 1, 24, 240, 2, 3]));
    // 229→Y, 0→2, 23→2, 46→2, 1→3, 24→3, (240 skipped), 2→4, 3→5.
    expect(code.slice(0, 8)).toBe('Y2223345');
  });

  it('spreads over the whole alphabet (2,300 characters from Web Crypto: each character appears)', () => {
    const counts = new Map<string, number>();
    for (let i = 0; i < 300; i++) for (const c of generateCardCode().slice(0, 8)) counts.set(c, (counts.get(c) ?? 0) + 1);
    expect(counts.size).toBe(23);
    // Expected 104 each; a character below 50 would be a broken generator (p < 1e-9 for a fair one).
    for (const count of counts.values()) expect(count).toBeGreaterThan(50);
  });

  it('fails with a sentence when the platform has no random source', () => {
    const saved = globalThis.crypto;
    Object.defineProperty(globalThis, 'crypto', { value: undefined, configurable: true });
    try {
      expect(() => generateCardCode()).toThrow('no cryptographic random source');
    } finally {
      Object.defineProperty(globalThis, 'crypto', { value: saved, configurable: true });
    }
  });
});

const codeArbitrary = fc.array(fc.integer({ min: 0, max: 255 }), { minLength: 32, maxLength: 32 }).map((stream) => generateCardCode(bytesFrom(stream)));

describe('the check character', () => {
  it('catches every single-character error (all 22 wrong characters at all 9 places)', () => {
    fc.assert(
      fc.property(codeArbitrary, (code) => {
        for (let at = 0; at < CARD_CODE_LENGTH; at++) {
          for (const wrong of CARD_CODE_ALPHABET) {
            if (wrong === code[at]) continue;
            const typo = code.slice(0, at) + wrong + code.slice(at + 1);
            if (isCardCode(typo)) return false;
          }
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });

  it('catches every adjacent transposition, and every other swap of two characters too', () => {
    fc.assert(
      fc.property(codeArbitrary, (code) => {
        for (let i = 0; i < CARD_CODE_LENGTH; i++) {
          for (let j = i + 1; j < CARD_CODE_LENGTH; j++) {
            if (code[i] === code[j]) continue;
            const chars = [...code];
            [chars[i], chars[j]] = [chars[j], chars[i]];
            if (isCardCode(chars.join(''))) return false;
          }
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });

  it('accepts exactly one check character for each body', () => {
    const body = 'K7M4RTX9';
    const fitting = [...CARD_CODE_ALPHABET].filter((c) => isCardCode(body + c));
    expect(fitting).toEqual([cardCodeCheckCharacter(body)]);
  });
});

describe('normalising and validating typed codes', () => {
  const code = 'K7M4RTX9X';

  it('ignores case, spaces, dashes and dots', () => {
    for (const typed of ['k7m-4rt-x9x', ' K7M 4RT X9X ', 'K7M.4RT.X9X', 'k7m–4rt—x9x', 'K7M4RTX9X']) {
      expect(validateCardCode(typed)).toEqual({ ok: true, code });
    }
  });

  it('reads Z, S, G and B (never in a code) as 2, 5, 6 and 8', () => {
    expect(normaliseCardCode('zsgb')).toBe('2568');
    const code = `22568ACE${cardCodeCheckCharacter('22568ACE')}`;
    expect(validateCardCode(`zz-sgb-ace${code[8].toLowerCase()}`)).toEqual({ ok: true, code });
  });

  it('names a character no code uses', () => {
    const result = validateCardCode('K7M-4RT-X9O');
    expect(result).toEqual({ ok: false, problem: 'character', message: expect.stringContaining('never contains the letter O') });
    expect(validateCardCode('K7M-4RT-X91')).toMatchObject({ problem: 'character', message: expect.stringContaining('the digit 1') });
    expect(validateCardCode('K7M-4RT-X9?')).toMatchObject({ problem: 'character', message: expect.stringContaining('“?”') });
  });

  it('says how many characters a code has', () => {
    expect(validateCardCode('K7M-4RT')).toEqual({ ok: false, problem: 'length', message: 'A card code has 9 characters (such as K7M-4RT-X9X); this one has 6.' });
    expect(validateCardCode('K7M-4RT-X9XX')).toMatchObject({ problem: 'length' });
  });

  it('says so when the check character does not fit', () => {
    expect(validateCardCode('K7M-4RT-X9A')).toMatchObject({ ok: false, problem: 'check', message: expect.stringContaining('does not fit') });
    expect(validateCardCode('7KM-4RT-X9X')).toMatchObject({ problem: 'check' });
  });

  it('asks for a code when nothing is given', () => {
    expect(validateCardCode('  - ')).toMatchObject({ ok: false, problem: 'empty', message: 'Type the code printed on the card.' });
  });

  it('prints in groups of three', () => {
    expect(formatCardCode(code)).toBe('K7M-4RT-X9X');
  });
});
