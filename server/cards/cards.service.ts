/**
 * The card preview: the same `buildCard` the device runs, on the server's copy of the revision.
 * Pilots preview the published revision; engineers (and approvers) also drafts and revisions in
 * review of their operator.
 */
import type { Role } from '@shared/auth/roles';
import { buildCard } from '@shared/card/build-card';
import { CardRefusedError, type CardInputs, type SpeedCard } from '@shared/card/card';
import type { CardPreviewRequest } from '@shared/card/card-api';
import { DomainError } from '../errors/domain-error';
import { loadCardSource, type CardSource } from './card-source';

/** The 422 of a refused card: the sentence, and the input at fault as a path of the request body. */
export function refusalError(error: CardRefusedError): DomainError {
  const field = error.field === 'revision' ? 'revisionId' : `inputs.${error.field}`;
  return new DomainError('refused', 'card_refused', error.message, { [field]: error.message });
}

/** `buildCard` on a loaded source; a refusal becomes the 422 `card_refused`. */
export function deriveCard(source: CardSource, inputs: unknown): SpeedCard {
  try {
    return buildCard(source.revision, inputs as CardInputs, source.context);
  } catch (error) {
    if (error instanceof CardRefusedError) throw refusalError(error);
    throw error;
  }
}

export async function previewCard(viewer: { operatorId: number; role: Role }, request: CardPreviewRequest): Promise<SpeedCard> {
  const source = await loadCardSource(viewer, request.revisionId, request.inputs['airframeId'], 'preview');
  return deriveCard(source, request.inputs);
}
