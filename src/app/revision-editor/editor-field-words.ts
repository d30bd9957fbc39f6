import type { SpeedClass } from './envelope-form';
import type { LimitKey } from './revision-form';

/** The words the revision editor shows beside its limit, weight and speed-class fields. */
export const LIMIT_FIELDS: readonly { key: LimitKey; label: string }[] = [
  { key: 'vnoKt', label: 'VNO' },
  { key: 'vneKt', label: 'VNE' },
  { key: 'vmoKt', label: 'VMO' },
  { key: 'mmo', label: 'MMO' },
  { key: 'vleKt', label: 'VLE' },
  { key: 'vloKt', label: 'VLO' },
  { key: 'vmcKt', label: 'VMC' },
  { key: 'vyseKt', label: 'VYSE' },
  // Wind figures of the flight manual ("Dem.": demonstrated, short enough for the field's label): the card cautions above them, never refuses.
  { key: 'demonstratedCrosswindKt', label: 'Dem. crosswind' },
  { key: 'maximumTailwindKt', label: 'Tailwind limit' },
];

/** Each class with the rounding the card gives it (issue 11: speeds by kind, not by spelling). */
export const SPEED_CLASS_WORDS: Readonly<Record<SpeedClass, string>> = {
  stall: 'Stall speed (rounded up)',
  minimum: 'Minimum speed, as VMC, V2, VREF (rounded up)',
  takeoff: 'Takeoff speed (nearest knot)',
  climb: 'Climb speed (nearest knot)',
  approach: 'Approach speed (nearest knot)',
  limit: 'Limit speed (rounded down)',
  other: 'Other (nearest knot)',
};

export const WEIGHT_FIELDS = [
  { key: 'minimumKg', label: 'Minimum weight' },
  { key: 'maximumTakeoffKg', label: 'Maximum takeoff weight' },
  { key: 'maximumLandingKg', label: 'Maximum landing weight' },
  { key: 'referenceKg', label: 'Reference weight' },
] as const;
