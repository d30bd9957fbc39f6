/** What the printed card is made from: the card and what the card log and the device add. */
import type { SpeedCard } from '../card/card';
import type { CardPaperSize } from './page-sizes';
import type { CardChanges } from './revision-marks';

export interface CardPdfInput {
  /** `buildCard`'s result (it carries its context: airframe, type, book, demo). */
  readonly card: SpeedCard;
  /**
   * The card-log entry's check code (printed form), printed as text and inside the QR code's
   * URL; null for a card issued offline that the server has not recorded yet (no code exists).
   */
  readonly code: string | null;
  /** The check URL on the operator's Speedwright host (the QR code holds it); null with no code. */
  readonly checkUrl: string | null;
  /** When the card was issued, ISO 8601. */
  readonly issuedAt: string;
  /** Where the data came from and how fresh it is, one sentence ("Data as of 2 Dec 2026, 01:30 UTC: …"). */
  readonly dataAsOf: string;
  /** Lines that changed since the previous revision (revision-marks.ts). */
  readonly changes: CardChanges;
  readonly paper: CardPaperSize;
}
