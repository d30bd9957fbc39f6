import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { SpeedCard } from '@shared/card';

/**
 * Icing conditions on a card (shared/card/card-icing.ts): each speed the book gives an ice
 * increment for, the normal figure beside the iced one (the normal IAS plus the increment, added
 * after rounding), marked by the word "Iced" and the ❄ symbol (never colour alone), and a note
 * for each configuration the book states no increment for. Shown by the card view, so the card
 * page and the check page say the same; nothing for a card without icing ticked.
 */
@Component({
  selector: 'sw-card-icing',
  template: `
    @if (card().icing; as icing) {
      <section class="icing-block" aria-labelledby="icing-title" data-testid="card-icing">
        <h3 id="icing-title"><span aria-hidden="true">❄ </span>Icing conditions</h3>
        @if (icing.speeds.length) {
          <table class="figures">
            <thead>
              <tr>
                <th scope="col">Speed</th>
                <th scope="col">Normal (kt IAS)</th>
                <th scope="col">Iced (kt IAS)</th>
              </tr>
            </thead>
            <tbody>
              @for (speed of icing.speeds; track speed.code + speed.configurationKey) {
                <tr data-testid="iced-speed" [attr.data-code]="speed.code" [attr.data-kt]="speed.icedIasKt">
                  <th scope="row">{{ speed.code }} <span class="fine">{{ speed.label }}, {{ speed.configurationLabel }}</span></th>
                  <td class="sw-mono">{{ speed.iasKt }}</td>
                  <td class="sw-mono iced"><span class="nowrap"><span aria-hidden="true">❄ </span>Iced {{ speed.icedIasKt }}</span> <span class="fine">(+{{ speed.incrementKt }})</span></td>
                </tr>
              }
            </tbody>
          </table>
        }
        @for (note of icing.notes; track note) {
          <p class="fine" role="note" data-testid="icing-note">{{ note }}</p>
        }
        <p class="fine">Iced speeds are the book's normal speeds plus its ice increment for the configuration; stall and limit speeds are not changed.</p>
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
    table {
      border-collapse: collapse;
      width: 100%;
    }
    th,
    td {
      text-align: left;
      padding: 4px 8px 4px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    td.iced {
      font-weight: 700;
    }
    .nowrap {
      white-space: nowrap;
    }
    .fine {
      margin: 4px 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardIcingView {
  readonly card = input.required<SpeedCard>();
}
