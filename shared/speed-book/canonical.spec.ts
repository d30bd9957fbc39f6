import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
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

  it('writes the RFC 8785 library text on its in-order fast path too', () => {
    // Keys already in UTF-16 order take JSON.stringify as it is; the canonicalize package (the
    // RFC 8785 form for JavaScript) is the outside reference for that text.
    const ordered = { a: 'é\u2028"\u0007', b: [1, { c: -0, d: 1e21, e: 0.1 + 0.2 }, null, true], f: { g: 5e-7 } };
    expect(canonicalJson(ordered)).toBe(canonicalize(ordered));
    const indexKeyFirst = { '9': 1, a: 2 };
    expect(canonicalJson(indexKeyFirst)).toBe('{"9":1,"a":2}');
    expect(() => canonicalJson({ a: 1, b: [Number.POSITIVE_INFINITY] })).toThrow('has no JSON form');
  });
});
