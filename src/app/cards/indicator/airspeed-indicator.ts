import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CardIndicator } from '@shared/card';
import { DIAL_CENTRE, DIAL_FACE_RADIUS, drawDial } from '@shared/card/indicator-geometry';

/**
 * The airspeed-indicator markings at this card's weight, drawn as the airworthiness rules define
 * them (white, green and yellow arcs, red and blue radial lines), on the basis the speed book
 * states, with a legend in words beside the dial. The drawing (shared/card/indicator-geometry.ts)
 * is the printed card's too.
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

  protected readonly centre = DIAL_CENTRE;
  protected readonly faceRadius = DIAL_FACE_RADIUS;
  private readonly drawing = computed(() => drawDial(this.indicator()));
  protected readonly scale = computed(() => this.drawing().scale);
  protected readonly unit = computed(() => this.drawing().unit);
  protected readonly basisWords = computed(() => this.drawing().basisWords);
  protected readonly ticks = computed(() => this.drawing().ticks);
  protected readonly numbers = computed(() => this.drawing().numbers);
  protected readonly arcs = computed(() => this.drawing().arcs);
  protected readonly lines = computed(() => this.drawing().lines);
  protected readonly summary = computed(() => this.drawing().summary);
}
