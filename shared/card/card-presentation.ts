/**
 * How a card reads, in words and figures, wherever it is shown: the card screen
 * (src/app/cards/speed-card-view) and the printed card (shared/card-pdf) use these, so paper and
 * screen say the same. Pure: no DOM, no Node.
 */
import type { SpeedPhase } from '../speed-book/revision-content';
import type { CardLimitKind, CardLimitSpeed, CardSpeed, SpeedCard } from './card';

/** The caution every screen and card that shows speeds carries (product rules). */
export const SAFETY_CAUTION = "Planning aid. The approved flight manual and the operator's procedures govern.";

export const DEMO_MARK = 'Demo operator: invented demo data — not for flight.';

/**
 * A card figure as printed: fixed decimals, thousands grouped with a comma, and an en dash for a
 * figure the data cannot give. Never "NaN": anything not a finite number prints the dash.
 */
export function cardNumber(value: number | null | undefined, decimals = 0): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '–';
  const fixed = (Math.round(value * 10 ** decimals) / 10 ** decimals + 0).toFixed(decimals);
  const [whole, fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return fraction === undefined ? grouped : `${grouped}.${fraction}`;
}

/** A signed figure: "+8.0", "−3.5", "0.0" (for ISA deviations). */
export function signedCardNumber(value: number, decimals = 1): string {
  const text = cardNumber(Math.abs(value), decimals);
  return value > 0 ? `+${text}` : value < 0 && text !== cardNumber(0, decimals) ? `−${text}` : text;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "30 Nov 2026, 08:00 UTC" without the device's locale or time zone. */
export function utcDate(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}, ${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())} UTC`;
}

export const PHASE_TITLES: Readonly<Record<SpeedPhase, string>> = {
  takeoff: 'Takeoff',
  climb: 'Climb',
  cruise: 'Cruise',
  approach: 'Approach',
  landing: 'Landing',
  any: 'Any phase',
};
export const PHASE_ORDER: readonly SpeedPhase[] = ['takeoff', 'climb', 'cruise', 'approach', 'landing', 'any'];

export interface PhaseGroup {
  readonly phase: SpeedPhase;
  readonly title: string;
  readonly speeds: readonly CardSpeed[];
}

/** The card's speeds by phase of flight, in flying order; phases without speeds are left out. */
export function phaseGroups(card: SpeedCard): PhaseGroup[] {
  return PHASE_ORDER.map((phase) => ({ phase, title: PHASE_TITLES[phase], speeds: card.speeds.filter((speed) => speed.phase === phase) })).filter(
    (group) => group.speeds.length > 0,
  );
}

export interface LimitRow {
  readonly code: string;
  /** Tells two rows of the same code apart (VFE per configuration). */
  readonly key: string;
  readonly meaning: string;
  readonly iasKt: number;
  readonly casKt: number;
}

/** The limit speeds of the card, in the order the card lists them (MMO and the crossover apart). */
export function limitRows(card: SpeedCard): LimitRow[] {
  const limits = card.limits;
  const rows: LimitRow[] = [];
  const add = (code: string, key: string, meaning: string, speed: CardLimitSpeed | null) => {
    if (speed) rows.push({ code, key, meaning, iasKt: speed.iasKt, casKt: speed.casKt });
  };
  add('VNE', 'VNE', 'Never exceed', limits.vne);
  add('VNO', 'VNO', 'Max. structural cruising', limits.vno);
  add('VMO', 'VMO', 'Maximum operating', limits.vmo);
  for (const vfe of limits.vfe) add('VFE', `VFE/${vfe.configurationKey}`, `Flap limit, ${vfe.configurationLabel}`, vfe);
  add('VLE', 'VLE', 'Gear extended', limits.vle);
  add('VLO', 'VLO', 'Gear operating', limits.vlo);
  add('VMC', 'VMC', 'Min. control, one engine out (rounded up)', limits.vmc);
  add('VYSE', 'VYSE', 'Best rate, one engine (target)', limits.vyse);
  return rows;
}

/** "Mach 0.680" or "150 KIAS (148 KCAS)". */
export function cruiseWords(card: SpeedCard): string {
  const cruise = card.cruise;
  return 'mach' in cruise ? `Mach ${cardNumber(cruise.mach, 3)}` : `${cardNumber(cruise.iasKt)} KIAS (${cardNumber(cruise.casKt)} KCAS)`;
}

export function limitKindWords(kind: CardLimitKind | null): string {
  return kind === null ? '' : kind.toUpperCase();
}

/** "published 30 Nov 2026, 08:00 UTC" or, for a draft preview, "draft preview, not published". */
export function publishedWords(card: SpeedCard): string {
  const at = card.revision.publishedAt;
  return at ? `published ${utcDate(at)}` : 'draft preview, not published';
}

/** Speeds computed at another weight than the takeoff weight (landing speeds at the landing weight) need a weight column. */
export function showsWeightColumn(card: SpeedCard): boolean {
  return card.speeds.some((speed) => speed.weightKg !== card.inputs.weightKg);
}
