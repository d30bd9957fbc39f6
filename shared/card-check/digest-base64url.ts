/**
 * A card's SHA-256 digest (64 hex digits) as the 43 base64url characters the check URL carries
 * (RFC 4648 §5, without padding), and back; check-url.ts uses both and re-exports them.
 */
const DIGEST_HEX = /^[0-9a-f]{64}$/;
/** The digest's length in base64url characters (32 bytes, no padding). */
export const DIGEST_B64_LENGTH = 43;
const B64URL = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';


/** 64 hex digits as 43 base64url characters. */
export function digestToBase64Url(hex: string): string {
  if (!DIGEST_HEX.test(hex)) throw new Error('A digest is 64 lower-case hexadecimal digits.');
  const bytes: number[] = [];
  for (let i = 0; i < 64; i += 2) bytes.push(parseInt(hex.slice(i, i + 2), 16));
  let text = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const chunk = (bytes[i] << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    const characters = i + 2 < bytes.length ? 4 : i + 1 < bytes.length ? 3 : 2;
    for (let k = 0; k < characters; k++) text += B64URL[(chunk >> (18 - 6 * k)) & 63];
  }
  return text;
}

/** 43 base64url characters as 64 hex digits; undefined when they are not a 32-byte value. */
export function base64UrlToDigest(text: string): string | undefined {
  if (text.length !== DIGEST_B64_LENGTH) return undefined;
  let bits = 0;
  let buffer = 0;
  let hex = '';
  for (const character of text) {
    const value = B64URL.indexOf(character);
    if (value < 0) return undefined;
    buffer = (buffer << 6) | value;
    bits += 6;
    if (bits >= 8) {
      bits -= 8;
      hex += ((buffer >> bits) & 255).toString(16).padStart(2, '0');
      buffer &= (1 << bits) - 1;
    }
  }
  // 43 characters are 258 bits: the last 2 must be zero in the canonical form.
  return buffer === 0 ? hex : undefined;
}
