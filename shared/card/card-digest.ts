/**
 * The digest of a speed card: SHA-256, lower-case hex, of the UTF-8 bytes of the RFC 8785
 * canonical JSON of the card without its `digest` field. The same on the device (browser) and
 * on the server (Node): canonical JSON fixes key order and number form, @noble/hashes needs no
 * platform API, and every figure of the card is rounded, so last-bit differences in Math
 * functions between engines cannot reach it.
 */
import { canonicalJson, sha256Hex } from '../speed-book/canonical';
import type { SpeedCard } from './card';

/**
 * `cardDigest(card)` of a card or of its body (the card without `digest`; a `digest` present is
 * left out either way).
 * @example cardDigest(buildCard(revision, inputs, context)) === card.digest // true
 */
export function cardDigest(card: SpeedCard | Omit<SpeedCard, 'digest'>): string {
  const { digest: _digest, ...body } = card as SpeedCard;
  return sha256Hex(canonicalJson(body));
}

/**
 * RFC 8785 canonical JSON of a card: `canonicalJson` of shared/speed-book, the one
 * implementation (it takes JSON.stringify as it is when the keys are already in order, as
 * `buildCard` writes them). Kept under this name for the card's callers.
 * @throws Error for NaN, Infinity or a value JSON cannot carry
 */
export const canonicalCardJson: (value: unknown) => string = canonicalJson;
