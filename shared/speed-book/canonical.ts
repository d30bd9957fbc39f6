/**
 * Canonical JSON (RFC 8785, JSON Canonicalization Scheme) and the SHA-256 of a revision's
 * content. Client and server both use these, so nothing here needs Node: the hash comes from
 * @noble/hashes, which runs in browsers too.
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';
import canonicalize from 'canonicalize';

/**
 * `value` as RFC 8785 canonical JSON: keys sorted, no spaces, ECMAScript number form. The one
 * canonical-JSON implementation of the product (revision content, signatures, card digests).
 *
 * The card's digest is on the path of every live update, so `buildCard` writes every object of
 * the card with its keys already in order; then the engine's own JSON.stringify is the canonical
 * form, once a walk has confirmed the order. Anything else is put in order by the `canonicalize`
 * package (RFC 8785's reference form for JavaScript).
 * @throws Error for NaN, Infinity or a value JSON cannot carry
 */
export function canonicalJson(value: unknown): string {
  if (inCanonicalOrder(value)) return JSON.stringify(value);
  const text = canonicalize(value);
  if (text === undefined) throw new Error('This value has no JSON form.');
  return text;
}

/** A key the engine lists first, as an array index (0 to 2³² − 2, no leading zeros). */
const INDEX_KEY = /^(0|[1-9][0-9]{0,9})$/;

/**
 * Whether JSON.stringify of `value` is already its RFC 8785 form: plain objects whose keys run
 * in UTF-16 order (none an array index), no toJSON, nothing JSON cannot carry. Throws on NaN
 * and Infinity, which JSON.stringify would quietly write as null.
 */
function inCanonicalOrder(value: unknown): boolean {
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new Error(`${value} has no JSON form.`);
      return true;
    case 'string':
    case 'boolean':
      return true;
    case 'object': {
      if (value === null) return true;
      if (Array.isArray(value)) {
        for (const item of value) if (item === undefined || !inCanonicalOrder(item)) return false;
        return true;
      }
      if (Object.getPrototypeOf(value) !== Object.prototype) return false;
      const record = value as Record<string, unknown>;
      let previous: string | undefined;
      for (const key in record) {
        if (previous === undefined ? INDEX_KEY.test(key) : previous >= key) return false;
        previous = key;
        const item = record[key];
        if (item !== undefined && !inCanonicalOrder(item)) return false;
      }
      return true;
    }
    default:
      return false;
  }
}

/** SHA-256, lower-case hex, of the UTF-8 bytes of the canonical JSON of `content`. */
export function contentSha256(content: unknown): string {
  return sha256Hex(canonicalJson(content));
}

/** SHA-256, lower-case hex, of the UTF-8 bytes of `text`. */
export function sha256Hex(text: string): string {
  return bytesToHex(sha256(utf8ToBytes(text)));
}
