/**
 * How a card is refused: `CardRefusedError` (card.ts) at the input at fault, and the mapping of
 * the flight-physics library's `AeroInputError` onto a refusal with the library's sentence.
 */
import { AeroInputError } from '../aero';
import { CardRefusedError, type CardRefusalCode } from './card';

/** Refuses the card: `code`, the input at fault (`field`, a path in the inputs) and a sentence. */
export function refuse(code: CardRefusalCode, field: string, message: string): never {
  throw new CardRefusedError(code, field, message);
}

/**
 * Runs `work`; an `AeroInputError` becomes a refusal at the input `fieldOf(error.field)`
 * carrying the library's sentence (after `prefix`, e.g. the speed's code).
 */
export function guarded<T>(work: () => T, fieldOf: (aeroField: string) => string, prefix = ''): T {
  try {
    return work();
  } catch (error) {
    if (!(error instanceof AeroInputError)) throw error;
    const code: CardRefusalCode =
      error.code === 'outside-table' ? 'outside-flight-manual-data' : error.code === 'invalid-table' ? 'invalid-content' : 'out-of-envelope';
    throw new CardRefusedError(code, fieldOf(error.field), prefix + error.message);
  }
}
