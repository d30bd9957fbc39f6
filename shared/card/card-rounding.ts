/**
 * Rounding as the card prints its figures (flight-physics.md, "Rounding by kind": limits down,
 * stall speeds up, others nearest) and the plain number words of its sentences.
 */
import { roundLimitKt, roundSpeedKt, roundStallKt } from '../aero';
import type { SpeedRounding } from '../speed-book/speed-class';

/** The rounding function of each rounding kind (flight-physics.md, "Rounding by kind"). */
export const ROUNDERS: Readonly<Record<SpeedRounding, (kt: number) => number>> = {
  'stall-up': roundStallKt,
  'limit-down': roundLimitKt,
  nearest: roundSpeedKt,
};

/** MMO rounded down to 0.001 (a limit; 10⁻⁹ tolerance as for knots, shared/aero/rounding.ts). */
export const floorMach3 = (mach: number) => Math.floor(mach * 1000 + 1e-9) / 1000 + 0;

/** To 0.1, 0.01, 0.001 and the whole foot; `+ 0` turns −0 into 0. */
export const round1 = (value: number) => Math.round(value * 10) / 10 + 0; // + 0 turns −0 into 0
export const round2 = (value: number) => Math.round(value * 100) / 100 + 0;
export const round3 = (value: number) => Math.round(value * 1000) / 1000 + 0;
export const roundFt = (value: number) => Math.round(value) + 0;

/** Whole numbers with thousands separators, without the locale (identical everywhere). */
export function group(value: number): string {
  return String(value).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** A weight in the card's sentences: "1,150 kg". */
export const kg = (value: number) => `${group(Math.round(value))} kg`;
