import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CardLimitSpeed, CardSpeed, SpeedCard } from '../../../shared/card';
import type { SpeedPhase } from '../../../shared/speed-book/revision-content';
import { SAFETY_CAUTION } from '../app';
import { AltitudeChart } from './altitude-chart';
import { CardNumberPipe, cardNumber } from './card-number-pipe';
import { AirspeedIndicator } from './indicator/airspeed-indicator';

/** One entered input as the pilot typed it, for the card's header. */
export interface EnteredInput {
  readonly label: string;
  readonly value: string;
}

interface PhaseGroup {
  readonly phase: SpeedPhase;
  readonly title: string;
  readonly speeds: readonly CardSpeed[];
}

interface LimitRow {
  readonly code: string;
  readonly meaning: string;
  readonly iasKt: number;
  readonly casKt: number;
}

const PHASE_TITLES: Readonly<Record<SpeedPhase, string>> = {
  takeoff: 'Takeoff',
  climb: 'Climb',
  cruise: 'Cruise',
  approach: 'Approach',
  landing: 'Landing',
  any: 'Any phase',
};
const PHASE_ORDER: readonly SpeedPhase[] = ['takeoff', 'climb', 'cruise', 'approach', 'landing', 'any'];

export const DEMO_MARK = 'Demo operator: invented demo data — not for flight.';

/** The speed card as the pilot reads it; every figure comes rounded from the card model. */
@Component({
  selector: 'sw-speed-card-view',
  imports: [MatIconModule, CardNumberPipe, AirspeedIndicator, AltitudeChart],
  templateUrl: './speed-card-view.html',
  styleUrl: './speed-card-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedCardView {
  readonly card = input.required<SpeedCard>();
  readonly entered = input<readonly EnteredInput[]>([]);

  protected readonly caution = SAFETY_CAUTION;
  protected readonly demoMark = DEMO_MARK;

  protected readonly published = computed(() => {
    const at = this.card().revision.publishedAt;
    return at ? `published ${utcDate(at)}` : 'draft preview, not published';
  });

  protected readonly phases = computed<PhaseGroup[]>(() => {
    const speeds = this.card().speeds;
    return PHASE_ORDER.map((phase) => ({ phase, title: PHASE_TITLES[phase], speeds: speeds.filter((speed) => speed.phase === phase) })).filter(
      (group) => group.speeds.length > 0,
    );
  });

  protected readonly takeoffWeightKg = computed(() => this.card().inputs.weightKg);

  protected readonly limitRows = computed<LimitRow[]>(() => {
    const limits = this.card().limits;
    const rows: LimitRow[] = [];
    const add = (code: string, meaning: string, speed: CardLimitSpeed | null) => {
      if (speed) rows.push({ code, meaning, iasKt: speed.iasKt, casKt: speed.casKt });
    };
    add('VNE', 'Never exceed', limits.vne);
    add('VNO', 'Max. structural cruising', limits.vno);
    add('VMO', 'Maximum operating', limits.vmo);
    for (const vfe of limits.vfe) add('VFE', `Flap limit, ${vfe.configurationLabel}`, vfe);
    add('VLE', 'Gear extended', limits.vle);
    add('VLO', 'Gear operating', limits.vlo);
    add('VMC', 'Min. control, one engine out (rounded up)', limits.vmc);
    add('VYSE', 'Best rate, one engine (target)', limits.vyse);
    return rows;
  });

  protected readonly caption = computed(() => `at ${cardNumber(this.card().inputs.weightKg)} kg`);

  protected readonly cruiseWords = computed(() => {
    const cruise = this.card().cruise;
    return 'mach' in cruise ? `Mach ${cardNumber(cruise.mach, 3)}` : `${cardNumber(cruise.iasKt)} KIAS (${cardNumber(cruise.casKt)} KCAS)`;
  });

  protected readonly limitWords = (kind: string | null) => (kind === null ? '' : kind.toUpperCase());

  protected readonly showWeightColumn = computed(() => this.card().speeds.some((speed) => speed.weightKg !== this.card().inputs.weightKg));
}

/** "30 Nov 2026, 08:00 UTC" without the device's locale or time zone. */
export function utcDate(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getUTCDate()} ${months[date.getUTCMonth()]} ${date.getUTCFullYear()}, ${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())} UTC`;
}
