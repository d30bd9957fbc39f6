import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { SpeedCard } from '@shared/card';
import {
  DEMO_MARK,
  SAFETY_CAUTION,
  cruiseWords,
  limitKindWords,
  limitRows,
  phaseGroups,
  publishedWords,
  showsWeightColumn,
  utcDate,
  type LimitRow,
  type PhaseGroup,
} from '@shared/card/card-presentation';
import { AltitudeChart } from './altitude-chart';
import { CardIcingView } from './card-icing-view';
import { CardWindView } from './card-wind-view';
import { CardNumberPipe, cardNumber } from './card-number-pipe';
import { AirspeedIndicator } from './indicator/airspeed-indicator';

/** One entered input as the pilot typed it, for the card's header. */
export interface EnteredInput {
  readonly label: string;
  readonly value: string;
}

export { DEMO_MARK, utcDate };

/** The speed card as the pilot reads it; every figure comes rounded from the card model. */
@Component({
  selector: 'sw-speed-card-view',
  imports: [MatIconModule, CardNumberPipe, AirspeedIndicator, AltitudeChart, CardWindView, CardIcingView],
  templateUrl: './speed-card-view.html',
  styleUrl: './speed-card-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedCardView {
  readonly card = input.required<SpeedCard>();
  readonly entered = input<readonly EnteredInput[]>([]);

  protected readonly caution = SAFETY_CAUTION;
  protected readonly demoMark = DEMO_MARK;

  protected readonly published = computed(() => publishedWords(this.card()));
  protected readonly phases = computed<PhaseGroup[]>(() => phaseGroups(this.card()));
  protected readonly takeoffWeightKg = computed(() => this.card().inputs.weightKg);
  protected readonly limitRows = computed<LimitRow[]>(() => limitRows(this.card()));
  protected readonly caption = computed(() => `at ${cardNumber(this.card().inputs.weightKg)} kg`);
  protected readonly cruiseWords = computed(() => cruiseWords(this.card()));
  protected readonly limitWords = limitKindWords;
  protected readonly showWeightColumn = computed(() => showsWeightColumn(this.card()));
}
