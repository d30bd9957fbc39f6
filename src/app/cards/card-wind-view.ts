import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CardWind, SpeedCard } from '@shared/card';
import { crosswindWords, directionWords, headwindWords, windWords } from '@shared/card/card-wind-words';

interface WindRow {
  readonly where: 'Departure' | 'Arrival';
  readonly wind: CardWind;
}

/**
 * The day's wind on a card (card-wind.ts): each aerodrome's runway, wind and components, the
 * approach speed (VREF + the operator's additive) with the policy it used, and the cautions
 * where the flight manual's crosswind or tailwind figures are exceeded. Shown by the card view,
 * so the card page and the check page say the same; nothing for a card without a wind.
 */
@Component({
  selector: 'sw-card-wind',
  imports: [MatIconModule],
  template: `
    @let c = card();
    @if (rows().length || c.approach) {
      <section class="wind-block" aria-labelledby="wind-title" data-testid="card-wind">
        <h3 id="wind-title">The day's wind</h3>
        @if (c.approach; as approach) {
          @for (speed of approach.speeds; track speed.code + speed.configurationKey) {
            <p class="approach" data-testid="approach-speed" [attr.data-kt]="speed.approachIasKt">
              <span class="label">Approach speed, {{ speed.configurationLabel }}</span>
              <span class="figure sw-mono">{{ speed.approachIasKt }}<small> kt IAS</small></span>
              <span class="sum sw-mono">= {{ speed.code }} {{ speed.vrefIasKt }} + {{ approach.additiveKt }}</span>
            </p>
          } @empty {
            <p class="fine">The speed book gives no VREF, so the card gives no approach speed.</p>
          }
          <p class="fine" data-testid="approach-policy">
            Additive {{ approach.additiveKt }} kt, by your operator's policy: {{ approach.policyStatement }} (the {{ approach.windAt }}'s wind).
          </p>
        }
        @for (row of rows(); track row.where) {
          <div class="aerodrome" data-testid="card-wind-components" [attr.data-where]="row.where">
            <h4>{{ row.where }}</h4>
            <dl>
              <div>
                <dt>Runway · wind</dt>
                <dd class="sw-mono">{{ directionWords(row.wind.runwayHeadingDeg) }} · {{ windWords(row.wind) }}</dd>
              </div>
              <div>
                <dt>Along the runway</dt>
                <dd data-testid="headwind" [attr.data-kt]="row.wind.headwindKt">
                  @if (row.wind.headwindKt < 0) {
                    <mat-icon aria-hidden="true" class="inline">warning</mat-icon>
                  }
                  {{ headwindWords(row.wind.headwindKt) }}
                </dd>
              </div>
              <div>
                <dt>Across</dt>
                <dd data-testid="crosswind" [attr.data-kt]="row.wind.crosswindKt">{{ crosswindWords(row.wind) }}</dd>
              </div>
              <div>
                <dt>In the gusts</dt>
                <dd>
                  @if (row.wind.gust; as gust) {
                    {{ headwindWords(gust.headwindKt) }}, crosswind {{ gust.crosswindKt }} kt
                  } @else {
                    no gusts given
                  }
                </dd>
              </div>
            </dl>
          </div>
        }
        @for (sentence of cautions(); track sentence) {
          <p class="sw-caution-note" role="note" data-testid="wind-caution"><mat-icon aria-hidden="true">warning</mat-icon><span><strong>Caution: </strong>{{ sentence }}</span></p>
        }
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    h3 {
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    .approach {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 12px;
      align-items: baseline;
      margin: 0 0 4px;
    }
    .approach .label {
      font: var(--mat-sys-title-small);
    }
    .approach .figure {
      font-size: 28px;
      font-weight: 700;
      line-height: 1.1;
    }
    .approach .figure small {
      font-size: 14px;
      font-weight: 400;
    }
    .approach .sum {
      color: var(--mat-sys-on-surface-variant);
    }
    .fine {
      margin: 4px 0 8px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .aerodrome {
      margin: 8px 0 0;
      padding: 8px 0;
      border-top: 1px solid var(--mat-sys-outline-variant);
    }
    h4 {
      margin: 0 0 4px;
      font: var(--mat-sys-title-small);
    }
    dl {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(10rem, 1fr));
      gap: 4px 16px;
      margin: 0;
    }
    dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      font: var(--mat-sys-body-large);
    }
    mat-icon.inline {
      font-size: 18px;
      width: 18px;
      height: 18px;
      vertical-align: -3px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardWindView {
  readonly card = input.required<SpeedCard>();

  protected readonly rows = computed<WindRow[]>(() => {
    const card = this.card();
    const rows: WindRow[] = [];
    if (card.departure.wind) rows.push({ where: 'Departure', wind: card.departure.wind });
    if (card.arrival?.wind) rows.push({ where: 'Arrival', wind: card.arrival.wind });
    return rows;
  });
  protected readonly cautions = computed(() => {
    const card = this.card();
    return [
      ...(card.departure.wind?.cautions.map((sentence) => `Departure: ${sentence}`) ?? []),
      ...(card.arrival?.wind?.cautions.map((sentence) => `Arrival: ${sentence}`) ?? []),
      ...(card.approach?.speeds.flatMap((speed) => (speed.caution ? [speed.caution] : [])) ?? []),
    ];
  });
  protected readonly directionWords = directionWords;
  protected readonly windWords = windWords;
  protected readonly headwindWords = headwindWords;
  protected readonly crosswindWords = crosswindWords;
}
