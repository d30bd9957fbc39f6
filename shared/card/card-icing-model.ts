/**
 * What a card holds of icing conditions (computed in card-icing.ts; part of `SpeedCard`,
 * card.ts, which re-exports these). Present only when the pilot ticked icing conditions.
 */

/** One speed of the card beside its iced figure: the printed IAS plus the book's ice increment. */
export interface CardIcedSpeed {
  readonly code: string;
  readonly label: string;
  readonly configurationKey: string;
  readonly configurationLabel: string;
  /** The normal speed as printed (IAS, kt, rounded by its class). */
  readonly iasKt: number;
  /** The book's ice increment for the configuration, whole kt. */
  readonly incrementKt: number;
  /** The iced speed: `iasKt + incrementKt` (the increment added after rounding), IAS, kt. */
  readonly icedIasKt: number;
}

/** The icing part of a card. */
export interface CardIcing {
  /** Each speed of the card the increment applies to, in the card's order. */
  readonly speeds: readonly CardIcedSpeed[];
  /**
   * One sentence per configuration of the card whose speeds would take an increment but for
   * which the book states none ("No ice increment stated for Flaps 15 …"): never guessed.
   */
  readonly notes: readonly string[];
}
