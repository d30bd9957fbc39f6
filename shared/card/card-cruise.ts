/**
 * The planned cruise: an IAS through the cruise configuration's position-error table to CAS
 * (never extrapolated), or a Mach number; and IAS back from CAS where that table covers it.
 */
import * as aero from '../aero';
import type { PositionErrorTable } from '../aero';
import type { CardInputs, SpeedCard } from './card';
import { guarded } from './card-refusal';
import { group } from './card-rounding';
import type { SpeedBook } from './speed-book-reader';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const { casToIasKt, iasToCasKt, roundSpeedKt } = aero;

/** The planned cruise as the altitude table reads it. */
export interface ComputedCruise {
  readonly card: SpeedCard['cruise'];
  /** CAS of an IAS cruise (null for a Mach cruise, or an IAS outside the table). */
  readonly casKt: number | null;
  /** Why an IAS cruise has no CAS: outside the cruise configuration's table (every row dashed). */
  readonly outsideTable: string | null;
}

/**
 * The planned cruise. An IAS outside the cruise configuration's position-error table gives no
 * CAS (never extrapolated): the card stands, and every altitude row says why it has a dash.
 */
export function plannedCruise(book: SpeedBook, cruise: CardInputs['cruise']): ComputedCruise {
  if ('mach' in cruise) return { card: { mach: cruise.mach }, casKt: null, outsideTable: null };
  const first = book.cruiseTable[0].iasKt;
  const last = book.cruiseTable[book.cruiseTable.length - 1].iasKt;
  if (cruise.iasKt < first || cruise.iasKt > last) {
    const note = `The cruise IAS of ${group(Math.round(cruise.iasKt))} kt is outside the cruise configuration's position-error table (${group(first)} to ${group(last)} KIAS); no figure is given.`;
    return { card: { casKt: null, iasKt: cruise.iasKt }, casKt: null, outsideTable: note };
  }
  const casKt = guarded(() => iasToCasKt(book.cruiseTable, cruise.iasKt), () => 'cruise.iasKt', 'Cruise: ');
  return { card: { casKt: roundSpeedKt(casKt), iasKt: cruise.iasKt }, casKt, outsideTable: null };
}

/** IAS of `casKt` through the cruise table, or null where the table gives no correction. */
export function iasWithinTable(cruiseTable: PositionErrorTable, casKt: number, round: (kt: number) => number): number | null {
  const first = cruiseTable[0].casKt;
  const last = cruiseTable[cruiseTable.length - 1].casKt;
  if (casKt < first || casKt > last) return null;
  return round(casToIasKt(cruiseTable, casKt));
}
