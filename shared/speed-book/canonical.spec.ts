import { createHash } from 'node:crypto';
import { canonicalJson, contentSha256 } from './canonical';

describe('canonical JSON and the content hash', () => {
  it('sorts keys and drops whitespace (RFC 8785)', () => {
    expect(canonicalJson({ b: [3, { y: 1, x: 2 }], a: 'é', c: 1.5e2 })).toBe('{"a":"é","b":[3,{"x":2,"y":1}],"c":150}');
  });

  it('hashes the UTF-8 bytes of the canonical JSON, the same whatever the key order', () => {
    // Node's own SHA-256 is the outside reference for @noble/hashes here.
    const expected = createHash('sha256').update('{"a":1,"b":"ü"}', 'utf8').digest('hex');
    expect(contentSha256({ b: 'ü', a: 1 })).toBe(expected);
    expect(contentSha256({ a: 1, b: 'ü' })).toBe(expected);
    expect(contentSha256({ a: 1, b: 'u' })).not.toBe(expected);
  });

  it('refuses numbers JSON cannot carry', () => {
    expect(() => canonicalJson({ a: Number.NaN })).toThrow();
    expect(() => canonicalJson(undefined)).toThrow('This value has no JSON form.');
  });
});
