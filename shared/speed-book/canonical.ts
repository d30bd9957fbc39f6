/**
 * Canonical JSON (RFC 8785, JSON Canonicalization Scheme) and the SHA-256 of a revision's
 * content. Client and server both use these, so nothing here needs Node: the hash comes from
 * @noble/hashes, which runs in browsers too.
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';
import canonicalize from 'canonicalize';

/** `value` as RFC 8785 canonical JSON: keys sorted, no spaces, ECMAScript number form. */
export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new Error('This value has no JSON form.');
  return text;
}

/** SHA-256, lower-case hex, of the UTF-8 bytes of the canonical JSON of `content`. */
export function contentSha256(content: unknown): string {
  return sha256Hex(canonicalJson(content));
}

/** SHA-256, lower-case hex, of the UTF-8 bytes of `text`. */
export function sha256Hex(text: string): string {
  return bytesToHex(sha256(utf8ToBytes(text)));
}
