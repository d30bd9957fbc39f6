/**
 * The digest check of a check URL: re-derive the card from the URL's inputs with `buildCard`
 * and the revision the card was built from, and compare digests — with the digest the URL
 * carries, and (online) with the digest of the card that was issued under the code.
 */
import { buildCard } from '../card/build-card';
import { CardRefusedError, type CardContext, type CardRevision, type SpeedCard } from '../card/card';
import type { CheckPayload } from './check-url';

export type FiguresCheck =
  /** The re-derived card has the digest of the code (and of the issued card, when known). */
  | { readonly outcome: 'matches'; readonly card: SpeedCard; readonly sentence: string }
  /** The code's figures are not the issued card's (or not the card their own digest names). */
  | { readonly outcome: 'differs'; readonly sentence: string; readonly detail: string };

export const FIGURES_DIFFER = 'The figures in this code do not match the card that was issued.';

export interface FiguresSource {
  readonly revision: CardRevision;
  readonly context: CardContext;
  /** The digest of the card issued under the code (the server's card log); null offline. */
  readonly issuedDigest: string | null;
}

/** Re-derives the card of `payload` from `source` and says whether it is the card the code stands for. */
export function checkFigures(payload: CheckPayload, source: FiguresSource): FiguresCheck {
  const number = source.revision.number;
  const differs = (detail: string): FiguresCheck => ({ outcome: 'differs', sentence: FIGURES_DIFFER, detail });
  if (payload.revisionId !== source.revision.id) {
    return differs(`The code names another revision than revision ${number}, which the card with this code was built from.`);
  }
  if (source.issuedDigest !== null && payload.digest !== source.issuedDigest) {
    return differs('The digest in the code is not the digest of the card issued under this code: the code was altered, or belongs to another card.');
  }
  let card: SpeedCard;
  try {
    card = buildCard(source.revision, payload.inputs, source.context);
  } catch (error) {
    if (!(error instanceof CardRefusedError)) throw error;
    return differs(`These inputs give no card from revision ${number}: ${error.message}`);
  }
  if (card.digest !== payload.digest) {
    return differs(`The card re-derived from these inputs and revision ${number} has another digest than the one in the code: the figures were altered.`);
  }
  return {
    outcome: 'matches',
    card,
    sentence:
      source.issuedDigest === null
        ? `The figures in this code re-derive, from this device’s copy of revision ${number}, to the digest the code carries.`
        : `The figures in this code match the card that was issued: re-derived from revision ${number}, they give the same digest.`,
  };
}
