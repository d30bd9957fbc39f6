import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CardIndicator, CardIndicatorArc, CardIndicatorLine } from '../../../../shared/card';
import { angleOfKt, arcPath, dialScale, polar } from './indicator-geometry';

const C = 120;
const TICK_OUTER = 112;
const COLOUR_ARC_RADIUS = 95;
const WHITE_ARC_RADIUS = 84;
const NUMBER_RADIUS = 64;
/** Radial lines cross both arc tracks and stop short of the numbers. */
const LINE_INNER_RADIUS = 77;
/** Line codes sit outside the bezel, beside the line's outer end, clear of the numbers. */
const LINE_LABEL_RADIUS = 126;

/** Words for each marking, so colour is never the only cue. */
const ARC_WORDS: Readonly<Record<CardIndicatorArc['colour'], string>> = {
  white: 'White arc — flap operating range, VS0 to VFE',
  green: 'Green arc — normal operating range, VS1 to VNO',
  yellow: 'Yellow arc — caution range, VNO to VNE: smooth air only',
};
const LINE_WORDS: Readonly<Record<CardIndicatorLine['code'], string>> = {
  VNE: 'Red line — VNE, never exceed',
  VMO: 'Red line — VMO, maximum operating speed (MMO governs above the crossover altitude)',
  VMC: 'Red line — VMC, minimum control speed with the critical engine inoperative',
  VYSE: 'Blue line — VYSE, best rate of climb on one engine',
};

interface DrawnArc {
  readonly colour: CardIndicatorArc['colour'];
  readonly path: string;
  readonly fromDeg: number;
  readonly toDeg: number;
  readonly words: string;
  readonly range: string;
}

interface DrawnLine {
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

/**
 * The airspeed-indicator markings at this card's weight, drawn as the airworthiness rules define
 * them (white, green and yellow arcs, red and blue radial lines), on the basis the speed book
 * states, with a legend in words beside the dial.
 */
@Component({
  selector: 'sw-airspeed-indicator',
  templateUrl: './airspeed-indicator.html',
  styleUrl: './airspeed-indicator.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'sw-airspeed-indicator' },
})
export class AirspeedIndicator {
  readonly indicator = input.required<CardIndicator>();
  /** Under the unit in the middle of the dial, e.g. "at 1,050 kg". */
  readonly caption = input('');

  protected readonly centre = C;
  protected readonly faceRadius = 116;
  protected readonly scale = computed(() => dialScale(this.indicator()));
  protected readonly unit = computed(() => (this.indicator().basis === 'ias' ? 'KIAS' : 'KCAS'));
  protected readonly basisWords = computed(() =>
    this.indicator().basis === 'ias' ? 'indicated airspeed (IAS)' : 'calibrated airspeed (CAS)',
  );

  protected readonly ticks = computed(() => {
    const scale = this.scale();
    const ticks: { x1: number; y1: number; x2: number; y2: number; major: boolean }[] = [];
    for (let kt = scale.minKt; kt <= scale.maxKt + 1e-9; kt += scale.minorStepKt) {
      const major = Math.abs(kt / scale.majorStepKt - Math.round(kt / scale.majorStepKt)) < 1e-9;
      const deg = angleOfKt(kt, scale);
      const outer = polar(C, C, TICK_OUTER, deg);
      const inner = polar(C, C, major ? TICK_OUTER - 12 : TICK_OUTER - 6, deg);
      ticks.push({ x1: outer.x, y1: outer.y, x2: inner.x, y2: inner.y, major });
    }
    return ticks;
  });

  protected readonly numbers = computed(() => {
    const scale = this.scale();
    const numbers: { x: number; y: number; text: string }[] = [];
    for (let kt = scale.minKt; kt <= scale.maxKt; kt += scale.majorStepKt) {
      const point = polar(C, C, NUMBER_RADIUS, angleOfKt(kt, scale));
      numbers.push({ x: point.x, y: point.y, text: String(kt) });
    }
    return numbers;
  });

  protected readonly arcs = computed<DrawnArc[]>(() => {
    const scale = this.scale();
    return this.indicator().arcs.map((arc) => {
      const fromDeg = angleOfKt(arc.fromKt, scale);
      const toDeg = angleOfKt(arc.toKt, scale);
      const radius = arc.colour === 'white' ? WHITE_ARC_RADIUS : COLOUR_ARC_RADIUS;
      return { colour: arc.colour, path: arcPath(C, C, radius, fromDeg, toDeg), fromDeg, toDeg, words: ARC_WORDS[arc.colour], range: `${arc.fromKt}–${arc.toKt}` };
    });
  });

  protected readonly lines = computed<DrawnLine[]>(() => {
    const scale = this.scale();
    return this.indicator().lines.map((line) => {
      const deg = angleOfKt(line.kt, scale);
      const outer = polar(C, C, TICK_OUTER, deg);
      const inner = polar(C, C, LINE_INNER_RADIUS, deg);
      const label = polar(C, C, LINE_LABEL_RADIUS, deg);
      const side = Math.sin((deg * Math.PI) / 180);
      const labelAnchor = side > 0.25 ? 'start' : side < -0.25 ? 'end' : 'middle';
      return { colour: line.colour, code: line.code, deg, x1: outer.x, y1: outer.y, x2: inner.x, y2: inner.y, labelX: label.x, labelY: label.y, labelAnchor, words: LINE_WORDS[line.code], kt: line.kt };
    });
  });

  protected readonly summary = computed(() => {
    const parts = [
      ...this.arcs().map((arc) => `${arc.words}, ${arc.range} kt`),
      ...this.lines().map((line) => `${line.words}, ${line.kt} kt`),
    ];
    return `Airspeed indicator markings in ${this.basisWords()}: ${parts.join('; ')}.`;
  });
}
