/**
 * The check page's signature check of a card's revision: the same Ed25519 verification a
 * device runs before it stores a revision (`revisionSignatureProblem`,
 * core/sync/revision-verification.ts), with the public key the card check's source names —
 * the operator's active key or one a rotation retired. Loaded only once a card's source is in.
 */
import type { VerifySource } from '@shared/card-check/verify-api';
import { importOperatorKeys, revisionSignatureProblem } from '../core/sync/revision-verification';

export type SignatureNote =
  | { readonly kind: 'verified'; readonly keyId: number; readonly keyRetiredAt: string | null }
  | { readonly kind: 'refused'; readonly sentence: string };

export async function checkSourceSignature(source: VerifySource, subtle: SubtleCrypto = globalThis.crypto.subtle): Promise<SignatureNote> {
  const { signature, revision, context } = source;
  const keys = await importOperatorKeys([{ id: signature.keyId, publicKey: signature.publicKey }], subtle);
  const problem = await revisionSignatureProblem(
    {
      id: revision.id,
      speedBookId: context.speedBook.id,
      number: revision.number,
      publishedAt: revision.publishedAt,
      content: revision.content as Record<string, unknown>,
      contentSha256: revision.contentSha256,
      signature: signature.value,
      signingKeyId: signature.keyId,
    },
    signature.operatorId,
    keys,
    subtle,
  );
  if (problem === null) return { kind: 'verified', keyId: signature.keyId, keyRetiredAt: signature.keyRetiredAt };
  return { kind: 'refused', sentence: `The revision this card was built from does not verify: ${problem} Do not use this card; tell the operator.` };
}
