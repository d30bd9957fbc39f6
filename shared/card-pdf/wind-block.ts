/**
 * The day's wind on the printed card's front, kept compact so a card with a wind keeps the pages
 * of the same card without one. Front: a line of inputs per aerodrome with its wind and steady
 * components, the approach speed (VREF + the operator's additive) inside each VREF's line of the
 * speeds table. Back, beside the aerodromes: the gust components, the operator's policy, and boxed
 * cautions only where the book's crosswind or tailwind figures (or a VFE) are exceeded. Nothing
 * for a card made without a wind.
 */
import type { Content } from 'pdfmake/interfaces';
import type { CardSpeed, CardWind, SpeedCard } from '../card/card';
import { approachShortPolicyWords, shortWindWords } from '../card/card-wind-words';
import { caution, fine } from './pdf-blocks';

/** Input lines (label, value) for each aerodrome with a wind. */
export function windInputRows(card: SpeedCard): [string, string][] {
  const rows: [string, string][] = [];
  if (card.departure.wind) rows.push(['Departure wind', shortWindWords(card.departure.wind, true)]);
  if (card.arrival?.wind) rows.push(['Arrival wind', shortWindWords(card.arrival.wind, true)]);
  return rows;
}

/**
 * The approach speed under a VREF's meaning, inside the VREF's own line (the line is as tall as
 * its large IAS figure, so a second line of fine text costs no height); null for other speeds.
 */
export function approachNote(card: SpeedCard, speed: CardSpeed): { text: string; bold: true; fontSize: number } | null {
  const approach = card.approach;
  const found = approach?.speeds.find((entry) => entry.code === speed.code && entry.configurationKey === speed.configurationKey);
  if (!approach || !found) return null;
  // The cautions are printed overleaf, beside the aerodromes; the approach line says so, in words.
  const overleaf = windCautionSentences(card).length ? ' · CAUTION overleaf' : '';
  return { text: `\nApproach ${found.approachIasKt} KIAS = ${found.code} + ${approach.additiveKt}${overleaf}`, bold: true, fontSize: 7 };
}

/**
 * The back page's lines beside the aerodromes (where the stall-in-turn table leaves room): each
 * wind with its gust components, the operator's policy that made the additive.
 */
export function windBackLines(card: SpeedCard): Content[] {
  const lines: Content[] = [];
  const gusts = (where: string, wind: CardWind) =>
    fine(`${where} wind ${shortWindWords(wind, false)}${wind.gust ? `; in the gusts ${wind.gust.headwindKt < 0 ? `tail ${-wind.gust.headwindKt}` : `head ${wind.gust.headwindKt}`}, cross ${wind.gust.crosswindKt}` : ''} (kt; cross from the right R or left L).`);
  if (card.departure.wind) lines.push(gusts('Departure', card.departure.wind));
  if (card.arrival?.wind) lines.push(gusts('Arrival', card.arrival.wind));
  if (card.approach) lines.push(fine(`${approachShortPolicyWords(card.approach)}${card.approach.speeds.length ? '' : ' The speed book gives no VREF, so no approach speed.'}`));
  return lines;
}

/** Boxed cautions: crosswind or tailwind above the book's figures, an approach speed at a VFE. */
export function windCautions(card: SpeedCard): Content[] {
  return windCautionSentences(card).map(caution);
}

function windCautionSentences(card: SpeedCard): string[] {
  return [
    ...(card.departure.wind?.cautions.map((sentence) => `Departure: ${sentence}`) ?? []),
    ...(card.arrival?.wind?.cautions.map((sentence) => `Arrival: ${sentence}`) ?? []),
    ...(card.approach?.speeds.flatMap((speed) => (speed.caution ? [speed.caution] : [])) ?? []),
  ];
}
