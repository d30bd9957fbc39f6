import { createHash, randomBytes } from 'node:crypto';
import { DomainError } from '../errors/domain-error';

/**
 * Tokens of invitation and password-reset links: 32 random bytes, sent once in the mail and
 * stored only as their SHA-256. A fast hash is enough here (unlike passwords) because the
 * token has 256 bits of entropy; nobody can guess one from its hash.
 */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export interface LinkState {
  expiresAt: Date;
  usedAt: Date | null;
  revokedAt: Date | null;
}

/** The words for each way a link can be spent, so invitations and resets say the same things. */
export interface LinkWording {
  unknown: string;
  used: string;
  replaced: string;
  expired: string;
}

/** Throws unless the link exists, is unused, not replaced and not past its time. */
export function assertLinkUsable<T extends LinkState>(link: T | null, words: LinkWording, now = new Date()): asserts link is T {
  if (!link) throw new DomainError('invalid', 'invalid_link', words.unknown, { token: words.unknown });
  if (link.usedAt) throw new DomainError('gone', 'link_used', words.used);
  if (link.revokedAt) throw new DomainError('gone', 'link_replaced', words.replaced);
  if (link.expiresAt.getTime() <= now.getTime()) throw new DomainError('gone', 'link_expired', words.expired);
}
