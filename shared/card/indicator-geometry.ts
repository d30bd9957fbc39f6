/**
 * Geometry of our airspeed-indicator picture: a linear scale from 0 kt swept clockwise through
 * 300°, from 150° left of the top to 150° right of it, the gap at the bottom for the unit.
 * Angles are degrees clockwise from 12 o'clock. The screen (src/app/cards/indicator) and the
 * printed card (shared/card-pdf) both draw `drawDial`, in a 240 × 240 box centred on (120, 120).
 */
import type { CardIndicator, CardIndicatorArc, CardIndicatorLine } from './card';

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

// ---------------------------------------------------------------------------------------------
// The drawing: every mark of the dial in the 240 × 240 box, with its words

export const DIAL_CENTRE = 120;
export const DIAL_FACE_RADIUS = 116;
export const DIAL_TICK_OUTER_RADIUS = 112;
export const DIAL_COLOUR_ARC_RADIUS = 95;
export const DIAL_WHITE_ARC_RADIUS = 84;
export const DIAL_NUMBER_RADIUS = 64;
/** Radial lines cross both arc tracks and stop short of the numbers. */
export const DIAL_LINE_INNER_RADIUS = 77;
/** Line codes sit outside the bezel, beside the line's outer end, clear of the numbers. */
export const DIAL_LINE_LABEL_RADIUS = 126;

/** Words for each marking, so colour is never the only cue. */
export const ARC_WORDS: Readonly<Record<CardIndicatorArc['colour'], string>> = {
  white: 'White arc — flap operating range, VS0 to VFE',
  green: 'Green arc — normal operating range, VS1 to VNO',
  yellow: 'Yellow arc — caution range, VNO to VNE: smooth air only',
};
export const LINE_WORDS: Readonly<Record<CardIndicatorLine['code'], string>> = {
  VNE: 'Red line — VNE, never exceed',
  VMO: 'Red line — VMO, maximum operating speed (MMO governs above the crossover altitude)',
  VMC: 'Red line — VMC, minimum control speed with the critical engine inoperative',
  VYSE: 'Blue line — VYSE, best rate of climb on one engine',
};

export interface DialTick {
  readonly x1: number;
  readonly y1: number;
  readonly x2: number;
  readonly y2: number;
  readonly major: boolean;
}

export interface DialNumber {
  readonly x: number;
  readonly y: number;
  readonly text: string;
}

export interface DialArc {
  readonly colour: CardIndicatorArc['colour'];
  readonly radius: number;
  /** SVG path data of the arc. */
  readonly path: string;
  readonly fromDeg: number;
  readonly toDeg: number;
  readonly fromKt: number;
  readonly toKt: number;
  readonly words: string;
  /** "45–85" (kt). */
  readonly range: string;
}

export interface DialLine {
  readonly colour: CardIndicatorLine['colour'];
  readonly code: CardIndicatorLine['code'];
  readonly deg: number;
  readonly x1: number;
  readonly y1: number;
  readonly x2: number;
  readonly y2: number;
  readonly labelX: number;
  readonly labelY: number;
  readonly labelAnchor: 'start' | 'middle' | 'end';
  readonly words: string;
  readonly kt: number;
}

export interface DialDrawing {
  readonly scale: DialScale;
  /** "KIAS" or "KCAS". */
  readonly unit: string;
  /** "indicated airspeed (IAS)" or "calibrated airspeed (CAS)". */
  readonly basisWords: string;
  readonly ticks: readonly DialTick[];
  readonly numbers: readonly DialNumber[];
  readonly arcs: readonly DialArc[];
  readonly lines: readonly DialLine[];
  /** One sentence of every marking, for a screen reader or a caption. */
  readonly summary: string;
}

/** Every mark of the dial for `indicator`. */
export function drawDial(indicator: CardIndicator): DialDrawing {
  const C = DIAL_CENTRE;
  const scale = dialScale(indicator);
  const ticks: DialTick[] = [];
  for (let kt = scale.minKt; kt <= scale.maxKt + 1e-9; kt += scale.minorStepKt) {
    const major = Math.abs(kt / scale.majorStepKt - Math.round(kt / scale.majorStepKt)) < 1e-9;
    const deg = angleOfKt(kt, scale);
    const outer = polar(C, C, DIAL_TICK_OUTER_RADIUS, deg);
    const inner = polar(C, C, major ? DIAL_TICK_OUTER_RADIUS - 12 : DIAL_TICK_OUTER_RADIUS - 6, deg);
    ticks.push({ x1: outer.x, y1: outer.y, x2: inner.x, y2: inner.y, major });
  }
  const numbers: DialNumber[] = [];
  for (let kt = scale.minKt; kt <= scale.maxKt; kt += scale.majorStepKt) {
    const point = polar(C, C, DIAL_NUMBER_RADIUS, angleOfKt(kt, scale));
    numbers.push({ x: point.x, y: point.y, text: String(kt) });
  }
  const arcs = indicator.arcs.map((arc): DialArc => {
    const fromDeg = angleOfKt(arc.fromKt, scale);
    const toDeg = angleOfKt(arc.toKt, scale);
    const radius = arc.colour === 'white' ? DIAL_WHITE_ARC_RADIUS : DIAL_COLOUR_ARC_RADIUS;
    return {
      colour: arc.colour,
      radius,
      path: arcPath(C, C, radius, fromDeg, toDeg),
      fromDeg,
      toDeg,
      fromKt: arc.fromKt,
      toKt: arc.toKt,
      words: ARC_WORDS[arc.colour],
      range: `${arc.fromKt}–${arc.toKt}`,
    };
  });
  const lines = indicator.lines.map((line): DialLine => {
    const deg = angleOfKt(line.kt, scale);
    const outer = polar(C, C, DIAL_TICK_OUTER_RADIUS, deg);
    const inner = polar(C, C, DIAL_LINE_INNER_RADIUS, deg);
    const label = polar(C, C, DIAL_LINE_LABEL_RADIUS, deg);
    const side = Math.sin((deg * Math.PI) / 180);
    const labelAnchor = side > 0.25 ? 'start' : side < -0.25 ? 'end' : 'middle';
    return { colour: line.colour, code: line.code, deg, x1: outer.x, y1: outer.y, x2: inner.x, y2: inner.y, labelX: label.x, labelY: label.y, labelAnchor, words: LINE_WORDS[line.code], kt: line.kt };
  });
  const basisWords = indicator.basis === 'ias' ? 'indicated airspeed (IAS)' : 'calibrated airspeed (CAS)';
  const parts = [...arcs.map((arc) => `${arc.words}, ${arc.range} kt`), ...lines.map((line) => `${line.words}, ${line.kt} kt`)];
  return {
    scale,
    unit: indicator.basis === 'ias' ? 'KIAS' : 'KCAS',
    basisWords,
    ticks,
    numbers,
    arcs,
    lines,
    summary: `Airspeed indicator markings in ${basisWords}: ${parts.join('; ')}.`,
  };
}
