/**
 * Pseudonyms for values the logs may not hold in clear (client addresses, e-mail addresses of
 * mail recipients): HMAC-SHA-256 (RFC 2104) under a key derived from SESSION_SECRET with
 * HKDF-SHA-256 (RFC 5869, info "speedwright log pseudonym"), the first 12 bytes in base64url.
 * The same value gives the same pseudonym on every instance that shares SESSION_SECRET, so the
 * lines of one client can be followed across instances; someone who holds the secret can compute
 * the pseudonym of an address to look for it, nobody else can go back from it.
 */
import { createHmac, hkdfSync } from 'node:crypto';

export type LogPseudonym = (value: string) => string;

const PSEUDONYM_BYTES = 12;
/** Recent pseudonyms kept, so the busiest route (the card check) hashes each client once; emptied when full. */
const CACHE_ENTRIES = 1024;

export function logPseudonym(secret: string): LogPseudonym {
  const key = Buffer.from(hkdfSync('sha256', secret, Buffer.alloc(0), 'speedwright log pseudonym', 32));
  const recent = new Map<string, string>();
  return (value) => {
    let pseudonym = recent.get(value);
    if (pseudonym === undefined) {
      pseudonym = createHmac('sha256', key).update(value, 'utf8').digest().subarray(0, PSEUDONYM_BYTES).toString('base64url');
      if (recent.size >= CACHE_ENTRIES) recent.clear();
      recent.set(value, pseudonym);
    }
    return pseudonym;
  };
}

/**
 * Anything shaped like `someone@somewhere`, the `@` also percent-encoded (`%40`, as in a query
 * string): an e-mail address, or the password and host of credentials in a URL.
 */
const ADDRESS_LIKE = /[^\s@"'<>(),;:/?&=#]+(?:@|%40)[^\s@"'<>(),;:/?&=#]+/gi;

/** The text with every e-mail address (or `user:password@host` part of a URL) replaced by `[address]`. */
export function maskAddresses(text: string): string {
  return text.replace(ADDRESS_LIKE, '[address]');
}
