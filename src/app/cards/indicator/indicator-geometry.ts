/**
 * Geometry of our airspeed-indicator picture: a linear scale from 0 kt swept clockwise through
 * 300°, from 150° left of the top to 150° right of it, the gap at the bottom for the unit.
 * Angles are degrees clockwise from 12 o'clock.
 */
import type { CardIndicator } from '../../../../shared/card';

export const DIAL_START_DEG = -150;
export const DIAL_SWEEP_DEG = 300;

export interface DialScale {
  readonly minKt: number;
  readonly maxKt: number;
  /** Numbered ticks. */
  readonly majorStepKt: number;
  readonly minorStepKt: number;
}

/**
 * A scale from 0 kt to a round figure at least 10 % above the highest marking, numbered every
 * 20 kt (40 kt above 300 kt) so the numbers never crowd.
 */
export function dialScale(indicator: CardIndicator): DialScale {
  const marks = [...indicator.arcs.map((arc) => arc.toKt), ...indicator.lines.map((line) => line.kt)];
  const highestKt = marks.length ? Math.max(...marks) : 200;
  const majorStepKt = highestKt > 300 ? 50 : highestKt > 180 ? 40 : 20;
  const maxKt = Math.ceil((highestKt * 1.1) / majorStepKt) * majorStepKt;
  return { minKt: 0, maxKt, majorStepKt, minorStepKt: majorStepKt / 4 };
}

/** Where `kt` sits on the dial; speeds beyond the scale stop at its ends. */
export function angleOfKt(kt: number, scale: DialScale): number {
  const clamped = Math.min(Math.max(kt, scale.minKt), scale.maxKt);
  return DIAL_START_DEG + ((clamped - scale.minKt) / (scale.maxKt - scale.minKt)) * DIAL_SWEEP_DEG;
}

export interface Point {
  readonly x: number;
  readonly y: number;
}

/** The point at `radius` from (cx, cy) at `deg` clockwise from 12 o'clock (SVG y grows downwards). */
export function polar(cx: number, cy: number, radius: number, deg: number): Point {
  const rad = (deg * Math.PI) / 180;
  return { x: round(cx + radius * Math.sin(rad)), y: round(cy - radius * Math.cos(rad)) };
}

/** An SVG path of the circular arc at `radius` from `fromDeg` clockwise to `toDeg`. */
export function arcPath(cx: number, cy: number, radius: number, fromDeg: number, toDeg: number): string {
  const start = polar(cx, cy, radius, fromDeg);
  const end = polar(cx, cy, radius, toDeg);
  const largeArc = toDeg - fromDeg > 180 ? 1 : 0;
  return `M ${start.x} ${start.y} A ${radius} ${radius} 0 ${largeArc} 1 ${end.x} ${end.y}`;
}

const round = (value: number) => Math.round(value * 100) / 100 + 0;
