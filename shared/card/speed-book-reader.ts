/**
 * A reader of one revision's (parsed, frozen) content: its configurations by key, the cruise
 * configuration's position-error table, the declared envelope and the limits, read once per
 * book — the envelope sweep reads the same book thousands of times.
 */
import type { PositionErrorTable } from '../aero';
import { bookEnvelope, type BookEnvelope } from '../speed-book/envelope';
import type { Configuration, RevisionContent } from '../speed-book/revision-content';
import { readLimits, type ComputedLimits } from './card-limits';
import { refuse } from './card-refusal';

/**
 * The configurations a card may be built for: those with takeoff speeds, or every
 * configuration when the speed book has none (for the screen's choice of takeoff configuration).
 */
export function takeoffConfigurationKeys(content: RevisionContent): string[] {
  const withTakeoffSpeeds = new Set(content.speeds.filter((speed) => speed.phase === 'takeoff').map((speed) => speed.configurationKey));
  const keys = content.configurations.map((configuration) => configuration.key);
  return withTakeoffSpeeds.size ? keys.filter((key) => withTakeoffSpeeds.has(key)) : keys;
}

/** Reads the figures of one revision's content. */
export class SpeedBook {
  private static readonly cache = new WeakMap<RevisionContent, SpeedBook>();

  /** One reader per (frozen, parsed) content: the sweep reads the same book thousands of times. */
  static of(content: RevisionContent): SpeedBook {
    let book = SpeedBook.cache.get(content);
    if (!book) {
      book = new SpeedBook(content);
      SpeedBook.cache.set(content, book);
    }
    return book;
  }

  readonly byKey = new Map<string, Configuration>();
  /** The first configuration is the cruise configuration (revision-content.ts). */
  readonly cruiseTable: PositionErrorTable;
  readonly envelope: BookEnvelope;
  private computedLimits: ComputedLimits | null = null;

  private constructor(readonly content: RevisionContent) {
    for (const configuration of content.configurations) this.byKey.set(configuration.key, configuration);
    this.cruiseTable = content.configurations[0].positionError;
    this.envelope = bookEnvelope(content);
  }

  /** The takeoff configuration `key`; refuses the card for a key without takeoff speeds. */
  takeoffConfiguration(key: string): Configuration {
    const configuration = this.byKey.get(key);
    const allowed = takeoffConfigurationKeys(this.content);
    if (!configuration || !allowed.includes(key)) {
      const labels = allowed.map((k) => `${this.byKey.get(k)!.label} (${k})`).join(', ');
      refuse(
        'unknown-configuration',
        'configuration',
        configuration
          ? `The speed book gives no takeoff speeds for ${configuration.label}; choose ${labels}.`
          : `The speed book has no configuration ${key}; choose ${labels}.`,
      );
    }
    return configuration;
  }

  /** The book's limits; they depend on nothing of the day, so they are read once per book. */
  limits(): ComputedLimits {
    this.computedLimits ??= readLimits(this.content);
    return this.computedLimits;
  }
}
