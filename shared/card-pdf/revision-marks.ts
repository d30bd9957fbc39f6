/**
 * Revision marks: which values of a card changed since the previous revision of its speed book.
 * The card of this revision is compared with the card the previous revision gives for the same
 * inputs, line by line as the printed card shows them (a speed, a limit, a stall-in-turn line, an
 * altitude-table row, an indicator marking). A line the previous revision cannot give — it did
 * not have that speed, or it refuses the card for these inputs — counts as changed. The first
 * revision of a book has nothing to compare with and carries no marks. Pure: no DOM, no Node.
 */
import { buildCard } from '../card/build-card';
import { CardRefusedError, type CardContext, type CardInputs, type CardRevision, type SpeedCard } from '../card/card';
import { limitRows } from '../card/card-presentation';

/** What the previous revision gives for the card's inputs. */
export type PreviousCard =
  /** The book has no revision published before this one. */
  | { readonly kind: 'none' }
  | { readonly kind: 'card'; readonly revisionNumber: number; readonly card: SpeedCard }
  /** The previous revision refuses a card for these inputs (e.g. the weight was outside its data). */
  | { readonly kind: 'refused'; readonly revisionNumber: number; readonly reason: string }
  /** There is a previous revision, but it is not at hand (a device that has not synced it). */
  | { readonly kind: 'unavailable'; readonly revisionNumber: number | null };

/** The previous revision's card for the same inputs and context; `previous` null: there is none. */
export function previousCardOf(previous: CardRevision | null, inputs: CardInputs, context: CardContext): PreviousCard {
  if (previous === null) return { kind: 'none' };
  try {
    return { kind: 'card', revisionNumber: previous.number, card: buildCard(previous, inputs, context) };
  } catch (error) {
    if (error instanceof CardRefusedError) return { kind: 'refused', revisionNumber: previous.number, reason: error.message };
    throw error;
  }
}

/** The lines of a card that carry a mark, by `cardLineKeys` key. */
export interface CardChanges {
  /** The revision compared with; null when there is none (first revision) or it is not at hand. */
  readonly againstRevision: number | null;
  /** Whether the comparison could be made at all (false: previous revision not at hand). */
  readonly compared: boolean;
  readonly changed: ReadonlySet<string>;
  /** Lines the previous revision's card had and this one has not, in words ("VNO, max. structural cruising"). */
  readonly removed: readonly string[];
}

export const NO_CHANGES: CardChanges = { againstRevision: null, compared: true, changed: new Set(), removed: [] };

/** Key of each line of the printed card. The document definition marks a line whose key is in `changed`. */
export const lineKey = {
  speed: (code: string, configurationKey: string) => `speed/${code}/${configurationKey}`,
  stall: (bankDeg: number) => `stall/${bankDeg}`,
  limit: (key: string) => `limit/${key}`,
  altitude: (pressureAltitudeFt: number) => `altitude/${pressureAltitudeFt}`,
  arc: (colour: string) => `indicator/arc/${colour}`,
  line: (code: string) => `indicator/line/${code}`,
  cruise: () => 'cruise',
  takeoffConfiguration: () => 'takeoff-configuration',
} as const;

interface Line {
  readonly words: string;
  readonly value: string;
}

/** Every line of a card that a revision can change, keyed, with its printed values in one string. */
export function cardLines(card: SpeedCard): Map<string, Line> {
  const lines = new Map<string, Line>();
  const put = (key: string, words: string, ...values: unknown[]) => lines.set(key, { words, value: JSON.stringify(values) });
  for (const speed of card.speeds) put(lineKey.speed(speed.code, speed.configurationKey), `${speed.code}, ${speed.label.toLowerCase()}`, speed.iasKt, speed.casKt, speed.weightKg, speed.configurationLabel);
  for (const line of card.stallInTurn) put(lineKey.stall(line.bankDeg), `stall speed at ${line.bankDeg}° bank`, line.iasKt, line.casKt);
  for (const row of limitRows(card)) put(lineKey.limit(row.key), `${row.code}, ${row.meaning.toLowerCase()}`, row.iasKt, row.casKt);
  if (card.limits.mmo !== null) put(lineKey.limit('MMO'), 'MMO', card.limits.mmo);
  if (card.crossoverAltitudeFt !== null) put(lineKey.limit('crossover'), 'crossover altitude', card.crossoverAltitudeFt);
  for (const row of card.altitudeTable) {
    put(lineKey.altitude(row.pressureAltitudeFt), `altitude-table row at ${row.pressureAltitudeFt} ft`, row.oatC, row.iasKt, row.casKt, row.easKt, row.tasKt, row.mach, row.limitIasKt, row.limitCasKt, row.limitKind, row.aboveLimit);
  }
  for (const arc of card.indicator.arcs) put(lineKey.arc(arc.colour), `${arc.colour} arc`, arc.fromKt, arc.toKt, card.indicator.basis);
  for (const line of card.indicator.lines) put(lineKey.line(line.code), `${line.code} line`, line.kt, card.indicator.basis);
  put(lineKey.cruise(), 'planned cruise', card.cruise);
  put(lineKey.takeoffConfiguration(), 'takeoff configuration', card.takeoffConfiguration.label);
  return lines;
}

/** The lines of `card` that differ from the previous revision's card for the same inputs. */
export function cardChanges(card: SpeedCard, previous: PreviousCard): CardChanges {
  const current = cardLines(card);
  switch (previous.kind) {
    case 'none':
      return NO_CHANGES;
    case 'unavailable':
      return { againstRevision: previous.revisionNumber, compared: false, changed: new Set(), removed: [] };
    case 'refused':
      // The previous revision gave no card for these inputs: every value is new.
      return { againstRevision: previous.revisionNumber, compared: true, changed: new Set(current.keys()), removed: [] };
    case 'card': {
      const before = cardLines(previous.card);
      const changed = new Set<string>();
      for (const [key, line] of current) if (before.get(key)?.value !== line.value) changed.add(key);
      const removed = [...before].filter(([key]) => !current.has(key)).map(([, line]) => line.words);
      return { againstRevision: previous.revisionNumber, compared: true, changed, removed };
    }
  }
}
