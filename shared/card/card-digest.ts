/**
 * The digest of a speed card: SHA-256, lower-case hex, of the UTF-8 bytes of the RFC 8785
 * canonical JSON of the card without its `digest` field. The same on the device (browser) and
 * on the server (Node): canonical JSON fixes key order and number form, @noble/hashes needs no
 * platform API, and every figure of the card is rounded, so last-bit differences in Math
 * functions between engines cannot reach it.
 */
import { sha256Hex } from '../speed-book/canonical';
import type { SpeedCard } from './card';

/**
 * `cardDigest(card)` of a card or of its body (the card without `digest`; a `digest` present is
 * left out either way).
 * @example cardDigest(buildCard(revision, inputs, context)) === card.digest // true
 */
export function cardDigest(card: SpeedCard | Omit<SpeedCard, 'digest'>): string {
  const { digest: _digest, ...body } = card as SpeedCard;
  return sha256Hex(canonicalCardJson(body));
}

/**
 * RFC 8785 canonical JSON of plain JSON data (what a card is): object keys sorted by UTF-16
 * code units, members whose value is undefined left out, numbers and strings as ECMAScript's
 * JSON.stringify writes them (which RFC 8785 adopts). The same text as `canonicalJson` of
 * shared/speed-book (checked in card-digest.spec.ts).
 *
 * The card's digest is on the path of every live update, so `buildCard` writes every object of
 * the card with its keys already in order; then the engine's own JSON.stringify is the canonical
 * form, once a walk has confirmed the order. Anything else is put in order by plain recursion.
 * @throws Error for NaN, Infinity or a value JSON cannot carry
 */
export function canonicalCardJson(value: unknown): string {
  return inCanonicalOrder(value) ? JSON.stringify(value) : recursiveCanonicalJson(value);
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

/** RFC 8785 by plain recursion: any JSON data, more slowly. */
function recursiveCanonicalJson(value: unknown): string {
  if (value === null) return 'null';
  if (typeof value === 'object' && typeof (value as { toJSON?: unknown }).toJSON === 'function') {
    return recursiveCanonicalJson((value as { toJSON(): unknown }).toJSON());
  }
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new Error(`${value} has no JSON form.`);
      return JSON.stringify(value);
    case 'string':
      return JSON.stringify(value);
    case 'boolean':
      return value ? 'true' : 'false';
    case 'object': {
      if (Array.isArray(value)) {
        return `[${value.map((item) => (item === undefined || typeof item === 'function' || typeof item === 'symbol' ? 'null' : recursiveCanonicalJson(item))).join(',')}]`;
      }
      const record = value as Record<string, unknown>;
      const members: string[] = [];
      for (const key of Object.keys(record).sort()) {
        const item = record[key];
        if (item !== undefined && typeof item !== 'function' && typeof item !== 'symbol') members.push(`${JSON.stringify(key)}:${recursiveCanonicalJson(item)}`);
      }
      return `{${members.join(',')}}`;
    }
    default:
      throw new Error(`A ${typeof value} has no JSON form.`);
  }
}
