/**
 * The envelope a speed book covers: takeoff and landing pressure-altitude and OAT ranges (the
 * content's `envelope`) and weights (the content's `weights`). The card is refused, in one
 * sentence, for a day outside it; the sweep (shared/card/coverage.ts) proves every point inside.
 *
 * A book without a declared envelope (content written before envelopes existed) cannot be
 * submitted (the server asks for one), but a revision already published without one still
 * builds cards: its envelope is derived from its own tables — the ranges every tabulated speed
 * of the phase covers — and, where no table bounds an axis, the wide default below, which is
 * what cards accepted before envelopes existed.
 */
import type { RevisionContent } from './revision-content';

export type EnvelopeRange = readonly [number, number];

export interface PhaseEnvelope {
  readonly pressureAltitudeFt: EnvelopeRange;
  readonly oatC: EnvelopeRange;
  readonly weightKg: EnvelopeRange;
}

export interface BookEnvelope {
  readonly takeoff: PhaseEnvelope;
  readonly landing: PhaseEnvelope;
  /** True when the book declares its envelope; false when it was derived (legacy content). */
  readonly declared: boolean;
}

/** Derived default where no table bounds an axis: from −2,000 ft (the old model floor) to the ceiling. */
const LEGACY_LOWEST_ALTITUDE_FT = -2000;
/** Derived default OAT range where no table bounds it, °C (the product's own, wide). */
const LEGACY_OAT_RANGE_C: EnvelopeRange = [-60, 55];

/** Phases of speeds read at the arrival (landing envelope); every other tabulated speed is takeoff. */
export const LANDING_PHASES: ReadonlySet<string> = new Set(['landing', 'approach']);

/** The envelope of `content`: declared, or derived from its tables for legacy content. */
export function bookEnvelope(content: RevisionContent): BookEnvelope {
  const { weights } = content;
  const takeoffWeights: EnvelopeRange = [weights.minimumKg, weights.maximumTakeoffKg];
  const landingWeights: EnvelopeRange = [weights.minimumKg, weights.maximumLandingKg];
  if (content.envelope) {
    const { takeoff, landing } = content.envelope;
    return {
      declared: true,
      takeoff: { pressureAltitudeFt: [takeoff.pressureAltitudeFt.min, takeoff.pressureAltitudeFt.max], oatC: [takeoff.oatC.min, takeoff.oatC.max], weightKg: takeoffWeights },
      landing: { pressureAltitudeFt: [landing.pressureAltitudeFt.min, landing.pressureAltitudeFt.max], oatC: [landing.oatC.min, landing.oatC.max], weightKg: landingWeights },
    };
  }
  return {
    declared: false,
    takeoff: { ...derivedRanges(content, false), weightKg: takeoffWeights },
    landing: { ...derivedRanges(content, true), weightKg: landingWeights },
  };
}

function derivedRanges(content: RevisionContent, landing: boolean): Pick<PhaseEnvelope, 'pressureAltitudeFt' | 'oatC'> {
  let altitude: [number, number] = [LEGACY_LOWEST_ALTITUDE_FT, content.aircraft.ceilingFt];
  let oat: [number, number] = [...LEGACY_OAT_RANGE_C];
  for (const speed of content.speeds) {
    if (speed.kind !== 'tabulated' || LANDING_PHASES.has(speed.phase) !== landing) continue;
    if (speed.byPressureAltitudeFt) altitude = intersect(altitude, speed.byPressureAltitudeFt);
    if (speed.byOatC) oat = intersect(oat, speed.byOatC);
  }
  return { pressureAltitudeFt: altitude, oatC: oat };
}

function intersect(range: [number, number], axis: readonly number[]): [number, number] {
  return [Math.max(range[0], axis[0]), Math.min(range[1], axis[axis.length - 1])];
}

/** Whole numbers with thousands separators and a real minus sign, without the locale. */
export function formatWhole(value: number): string {
  const rounded = Math.round(value);
  const grouped = String(Math.abs(rounded)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return (rounded < 0 ? '−' : '') + grouped;
}

/** "−1,000 to 8,000 ft" */
export function formatRange(range: EnvelopeRange, unit: string): string {
  return `${formatWhole(range[0])} to ${formatWhole(range[1])} ${unit}`;
}
