/**
 * Checks a revision from `GET /api/sync` before the device stores it: the SHA-256 of its
 * content (shared/speed-book/canonical.ts) must equal the hash it carries, and its Ed25519
 * signature (RFC 8032) over `signedRevisionStatement()` (shared/speed-book/signature.ts) must
 * verify with the operator's public key that its `signingKeyId` names — the active key or one
 * a rotation retired — through WebCrypto (`crypto.subtle`, Ed25519). A revision naming a key
 * the operator never published is refused. No Angular here.
 */
import type { SyncRevision } from '@shared/api/sync';
import { contentSha256 } from '@shared/speed-book/canonical';
import { signedRevisionStatement } from '@shared/speed-book/signature';

export interface VerifyingOperator {
  readonly id: number;
}

/** One public key of the operator as the server published it. */
export interface PublishedKey {
  readonly id: number;
  /** Raw 32-byte Ed25519 public key, standard base64. */
  readonly publicKey: string;
}

/** The operator's keys by id, imported for WebCrypto (null: the published key is not a raw Ed25519 key). */
export type OperatorKeys = ReadonlyMap<number, CryptoKey | null>;

export type Verification = { readonly ok: true } | { readonly ok: false; readonly sentence: string };

/** Standard base64 → bytes, or null when it is not base64. */
export function base64Bytes(text: string): Uint8Array<ArrayBuffer> | null {
  try {
    const binary = atob(text);
    const bytes = new Uint8Array(binary.length);
    for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
    return bytes;
  } catch {
    return null;
  }
}

/** The operator's public key as a WebCrypto key, or null when it is not a raw Ed25519 key. */
export async function importOperatorKey(publicKeyBase64: string, subtle: SubtleCrypto = globalThis.crypto.subtle): Promise<CryptoKey | null> {
  const raw = base64Bytes(publicKeyBase64);
  if (!raw || raw.length !== 32) return null;
  try {
    return await subtle.importKey('raw', raw, { name: 'Ed25519' }, false, ['verify']);
  } catch {
    return null;
  }
}

/** Every published key, imported once (a key that does not import stays, as null, so its revisions say why). */
export async function importOperatorKeys(keys: readonly PublishedKey[], subtle: SubtleCrypto = globalThis.crypto.subtle): Promise<Map<number, CryptoKey | null>> {
  const imported = new Map<number, CryptoKey | null>();
  for (const key of keys) imported.set(key.id, await importOperatorKey(key.publicKey, subtle));
  return imported;
}

function named(revision: SyncRevision): string {
  return `Revision ${revision.number} of ${revision.speedBookTitle}`;
}

/** The fields of a published revision its signature covers, with the signature and the key id it names. */
export type SignedRevision = Pick<SyncRevision, 'id' | 'speedBookId' | 'number' | 'publishedAt' | 'content' | 'contentSha256' | 'signature' | 'signingKeyId'>;

/**
 * Why `revision` is not exactly what the operator's key signed (a clause ending with a full
 * stop), or null when it is. `keys` are the operator's published keys by id
 * (`importOperatorKeys`); the revision is checked with the one its `signingKeyId` names. The
 * device's sync and the check page share it.
 */
export async function revisionSignatureProblem(
  revision: SignedRevision,
  operatorId: number,
  keys: OperatorKeys,
  subtle: SubtleCrypto = globalThis.crypto.subtle,
): Promise<string | null> {
  if (!keys.has(revision.signingKeyId)) return `it names signing key No. ${revision.signingKeyId}, which your operator never published.`;
  const key = keys.get(revision.signingKeyId) ?? null;
  if (key === null) return `the operator’s public key No. ${revision.signingKeyId} the server sent is not a valid Ed25519 key.`;
  let hash: string;
  try {
    hash = contentSha256(revision.content);
  } catch {
    return 'its content cannot be read.';
  }
  if (hash !== revision.contentSha256) return 'its content does not match the hash it was published with, so it may have been changed.';
  const signature = base64Bytes(revision.signature);
  if (!signature || signature.length !== 64) return 'its signature is not a valid Ed25519 signature.';
  const statement = signedRevisionStatement({
    operatorId,
    speedBookId: revision.speedBookId,
    revisionId: revision.id,
    number: revision.number,
    contentSha256: revision.contentSha256,
    publishedAt: revision.publishedAt,
  });
  let valid = false;
  try {
    valid = await subtle.verify({ name: 'Ed25519' }, key, signature, new TextEncoder().encode(statement));
  } catch {
    valid = false;
  }
  return valid ? null : `its signature does not verify with the operator’s public key No. ${revision.signingKeyId}, so it may have been changed or not come from your operator.`;
}

/**
 * Whether a revision from a sync may be stored: `revisionSignatureProblem`, with the sentence
 * naming the revision and what failed, for the person at the device.
 */
export async function verifyRevision(
  revision: SyncRevision,
  operator: VerifyingOperator,
  keys: OperatorKeys,
  subtle: SubtleCrypto = globalThis.crypto.subtle,
): Promise<Verification> {
  const why = await revisionSignatureProblem(revision, operator.id, keys, subtle);
  if (why === null) return { ok: true };
  return { ok: false, sentence: `${named(revision)} was not stored on this device: ${why} Cards keep using the data already here; tell your operator's administrator.` };
}
