import { randomBytes } from 'node:crypto';
import { TEST_SIGNING_KEY_SECRET } from '../test/api/constants';
import { estimatedSecretBits, PUBLISHED_SECRETS, secretWeakness } from './secret-strength';

describe('secretWeakness', () => {
  it('passes what `openssl rand -base64 32` and `openssl rand -hex 32` make', () => {
    // 200 draws of each: the refusal chance per draw is a few in a million (secret-strength.ts).
    for (let i = 0; i < 200; i++) {
      expect(secretWeakness(randomBytes(32).toString('base64'))).toBeNull();
      expect(secretWeakness(randomBytes(32).toString('hex'))).toBeNull();
    }
  });

  it('refuses what people type instead of a secret, saying why', () => {
    expect(secretWeakness('short-but-random-Xq7#')).toBe('is shorter than 32 characters');
    expect(secretWeakness('a'.repeat(40))).toBe('uses only 1 different characters (at least 10 needed)');
    expect(secretWeakness('changeme-changeme-changeme-changeme')).toBe('contains "changeme", which marks a placeholder rather than a secret');
    expect(secretWeakness('qwertyuiopasdfghjklzxcvbnm1234567890')).toBe('contains the run "1234567"');
    expect(secretWeakness('zyxwvutsrqPONMLKJIHG9876543210!?')).toBe('contains the run "zyxwvut"');
    expect(secretWeakness('Tr0ub4dor&3Tr0ub4dor&3Tr0ub4dor&3!!')).toBe('repeats "Tr0ub4d"');
    expect(secretWeakness('my-super-secret-session-secret-value')).toBe('repeats "-secret"');
  });

  it('refuses every value published with the tests and the benchmarks', () => {
    const tests = ['test-session-secret-that-is-long-enough-0123456789', TEST_SIGNING_KEY_SECRET, 'bench-session-secret-that-is-long-enough-0123456789'];
    for (const value of tests) {
      expect(PUBLISHED_SECRETS).toContain(value);
      expect(secretWeakness(value)).toMatch(/^is a value published with Speedwright/);
    }
  });

  it('refuses a value whose characters are too uneven to carry 96 bits', () => {
    // 10 distinct characters, no run, no repeated 7-piece, but one character is most of it.
    const uneven = 'x0xx1xx2xx3xx4xx5xx6xx7xx8xx9xxx';
    expect(secretWeakness(uneven)).toMatch(/^carries about \d+ bits by its character frequencies \(at least 96 needed\)$/);
  });

  it('estimates information by Shannon’s formula over the string’s own frequencies', () => {
    // Shannon 1948: two symbols equally often give 1 bit each; one symbol gives none.
    expect(estimatedSecretBits('abababab')).toBeCloseTo(8, 10);
    expect(estimatedSecretBits('aaaa')).toBe(0);
    // 64 distinct characters once each: log2(64) = 6 bits each.
    expect(estimatedSecretBits('ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/')).toBeCloseTo(384, 10);
  });
});
