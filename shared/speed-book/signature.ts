/**
 * What an operator's signing key signs when a revision is published, built the same way on the
 * server (to sign) and on devices (to verify). No Node APIs here.
 *
 * The signed bytes are the UTF-8 bytes of the canonical JSON (RFC 8785) of
 *
 *   { "contentSha256": <hex SHA-256 of the canonical JSON of the content>,
 *     "number": <revision number within its speed book>,
 *     "operatorId": <operator id>,
 *     "publishedAt": <ISO 8601 UTC, whole seconds, e.g. "2026-12-01T22:30:00.000Z">,
 *     "purpose": "speedwright.revision.v1",
 *     "revisionId": <revision id>,
 *     "speedBookId": <speed book id> }
 *
 * signed with Ed25519 (RFC 8032, pure, no pre-hash); the signature is the 64 bytes in standard
 * base64. To verify: recompute `contentSha256(content)`, rebuild the statement from the
 * revision's fields with `signedRevisionStatement`, and check the signature against the raw
 * 32-byte public key from `GET /api/operator/signing-key` (WebCrypto `importKey('raw', …,
 * 'Ed25519')` or @noble/ed25519 `verify`).
 */
import { canonicalJson } from './canonical';

export const SIGNATURE_PURPOSE = 'speedwright.revision.v1';

export interface SignedRevisionFields {
  operatorId: number;
  speedBookId: number;
  revisionId: number;
  number: number;
  contentSha256: string;
  /** ISO 8601 UTC with whole seconds. */
  publishedAt: string;
}

/** The exact text whose UTF-8 bytes are signed for a published revision. */
export function signedRevisionStatement(fields: SignedRevisionFields): string {
  return canonicalJson({
    contentSha256: fields.contentSha256,
    number: fields.number,
    operatorId: fields.operatorId,
    publishedAt: fields.publishedAt,
    purpose: SIGNATURE_PURPOSE,
    revisionId: fields.revisionId,
    speedBookId: fields.speedBookId,
  });
}
