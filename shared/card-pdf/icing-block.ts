/**
 * Icing conditions on the printed card, kept compact so a card with icing keeps the pages of the
 * same card without it: the iced figure inside the speed's own line of the speeds table (the line
 * is as tall as its large IAS figure, so a line of small text costs no height), marked by the word
 * ICED and the » sign (never colour alone); on the back, one line per configuration the book
 * states no ice increment for. Nothing for a card made without icing ticked.
 */
import type { Content } from 'pdfmake/interfaces';
import type { CardSpeed, SpeedCard } from '../card/card';
import { fine } from './pdf-blocks';

/** The iced figure under a speed's meaning, inside its line; null for speeds without one. */
export function icedNote(card: SpeedCard, speed: CardSpeed): { text: string; bold: true; fontSize: number } | null {
  const found = card.icing?.speeds.find((entry) => entry.code === speed.code && entry.configurationKey === speed.configurationKey);
  if (!found) return null;
  return { text: `\nICED » ${found.icedIasKt} KIAS = ${found.code} + ${found.incrementKt} ice`, bold: true, fontSize: 7 };
}

/** The back page's lines on icing: that icing was ticked, and each configuration without an increment. */
export function icingBackLines(card: SpeedCard): Content[] {
  if (!card.icing) return [];
  return [fine(`Icing conditions: ICED » figures are the normal IAS plus the book's ice increment; stall and limit speeds unchanged. ${card.icing.notes.join(' ')}`.trim())];
}
