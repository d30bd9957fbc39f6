/**
 * What a speed is, whatever the flight manual spells it. The card's rounding and the ordering
 * rules follow the class, never the spelling: a book may print "VSO", "VS1G" or "VSR0" and the
 * card shows the code as the book states it, while every rule reads it as VS0 or VS1.
 *
 * Rounding by class (flight-physics.md, "Rounding by kind"; common practice): a stall or minimum
 * speed is rounded up so the card never promises control below it; a limit down so it never
 * allows more than the limit; every other speed to the nearest knot.
 */
import type { SPEED_CLASSES } from './content-shape';

export type SpeedClass = (typeof SPEED_CLASSES)[number];

/**
 * The role a code plays in the ordering rules and the indicator markings: the trade's
 * canonical spelling, or null for a code of the book's own (VBG, VAPP, …).
 */
export type SpeedRole =
  | 'VS0'
  | 'VS1'
  | 'VS'
  | 'V1'
  | 'VR'
  | 'V2'
  | 'VREF'
  | 'VX'
  | 'VY'
  | 'VA'
  | 'VMC'
  | 'VAPP';

/**
 * Spellings seen in flight manuals, upper-cased, → role. The letter O for the digit 0 (VSO),
 * a trailing G for the 1-g stall (VS1G), and R for a reference stall speed (VSR0, VSR1, VSR).
 */
const ROLE_BY_SPELLING: ReadonlyMap<string, SpeedRole> = new Map<string, SpeedRole>([
  ['VS0', 'VS0'], ['VSO', 'VS0'], ['VS0G', 'VS0'], ['VSOG', 'VS0'], ['VSR0', 'VS0'], ['VSRO', 'VS0'],
  ['VS1', 'VS1'], ['VS1G', 'VS1'], ['VSR1', 'VS1'], ['VSR', 'VS1'],
  ['VS', 'VS'], ['VSG', 'VS'],
  ['V1', 'V1'], ['VR', 'VR'], ['V2', 'V2'],
  ['VREF', 'VREF'], ['VX', 'VX'], ['VY', 'VY'], ['VA', 'VA'], ['VO', 'VA'],
  ['VMC', 'VMC'], ['VMCA', 'VMC'], ['VAPP', 'VAPP'],
]);

/** The class a role has when the book does not say. */
const CLASS_BY_ROLE: Readonly<Record<SpeedRole, SpeedClass>> = {
  VS0: 'stall', VS1: 'stall', VS: 'stall',
  V1: 'takeoff', VR: 'takeoff', V2: 'minimum',
  VREF: 'minimum', VMC: 'minimum',
  VX: 'climb', VY: 'climb',
  VA: 'limit',
  VAPP: 'approach',
};

/** Other codes that are limits by their name (a book may list them as speeds too). */
const LIMIT_CODES = new Set(['VNO', 'VNE', 'VFE', 'VLE', 'VLO', 'VMO', 'VB']);

/**
 * The role of `code` in the rules, whatever its spelling; null for a code of the book's own.
 * @example speedRole('VSO') // 'VS0'
 * @example speedRole('VS1G') // 'VS1'
 * @example speedRole('VBG') // null
 */
export function speedRole(code: string): SpeedRole | null {
  return ROLE_BY_SPELLING.get(code.toUpperCase()) ?? null;
}

/** True when `code` names a reference stall speed (VSR0, VSR1, VSR): CS-25 / Part 25 style. */
export function isReferenceStallCode(code: string): boolean {
  return /^VSR[01O]?$/i.test(code);
}

/**
 * The class of a speed: the one the book declares, else the one its code implies, else 'other'.
 * @example speedClassOf({ code: 'VSO' }) // 'stall'
 * @example speedClassOf({ code: 'VBG' }) // 'other'
 */
export function speedClassOf(speed: { readonly code: string; readonly speedClass?: SpeedClass }): SpeedClass {
  if (speed.speedClass) return speed.speedClass;
  const role = speedRole(speed.code);
  if (role) return CLASS_BY_ROLE[role];
  return LIMIT_CODES.has(speed.code.toUpperCase()) ? 'limit' : 'other';
}

/** How a speed of `speedClass` is rounded on the card. */
export type SpeedRounding = 'stall-up' | 'limit-down' | 'nearest';

/** Stall and minimum speeds up, limits down, the others to the nearest knot. */
export function roundingOfClass(speedClass: SpeedClass): SpeedRounding {
  if (speedClass === 'stall' || speedClass === 'minimum') return 'stall-up';
  if (speedClass === 'limit') return 'limit-down';
  return 'nearest';
}
