import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RevisionNotices } from '../core/sync/revision-notices';
import { SyncStatusPanel } from '../core/sync/sync-status-panel';
import { MAX_WIND_KT } from '@shared/card';
import { WIND_REFERENCE_SENTENCE, directionUnit } from '@shared/card/card-wind-words';
import { ALTITUDE_STEPS_FT, type FormFieldPath } from './card-form';

const DIRECTION_UNIT = directionUnit();
import { CardFormModel } from './card-form-model';
import { CardIssuing } from './card-issuing';
import { CardNumberPipe } from './card-number-pipe';
import { CardRevisionSelection } from './card-revision-selection';
import { DeviceCardLog } from './device-card-log';
import { SpeedCardView } from './speed-card-view';
import { TatDeviation } from './tat-deviation';

export { CARD_DEBOUNCE_MS } from './card-form-model';

/**
 * The speed card: choose the airframe, type the day's weight and atmosphere in the units you
 * like, and read the card as you type. The card is computed on this device with the same
 * `buildCard` the server runs, so it needs no network once the revision is here.
 *
 * The page only presents its three component-scoped stores: the revision selection
 * (card-revision-selection.ts), the form model and the card (card-form-model.ts), and issuing and
 * printing (card-issuing.ts).
 */
@Component({
  selector: 'sw-cards-page',
  imports: [
    NgTemplateOutlet,
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatIconModule,
    MatProgressBarModule,
    CardNumberPipe,
    SpeedCardView,
    TatDeviation,
    DeviceCardLog,
    SyncStatusPanel,
    RevisionNotices,
  ],
  providers: [CardRevisionSelection, CardFormModel, CardIssuing],
  templateUrl: './cards-page.html',
  styleUrl: './cards-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardsPage {
  protected readonly selection = inject(CardRevisionSelection);
  protected readonly model = inject(CardFormModel);
  protected readonly issuer = inject(CardIssuing);

  protected readonly altitudeSteps = ALTITUDE_STEPS_FT;
  protected readonly windReference = WIND_REFERENCE_SENTENCE;
  private readonly windControls = [
    { control: 'runwayHeading', label: 'Runway heading', unit: DIRECTION_UNIT, hint: '1 to 360' },
    { control: 'windDirection', label: 'Wind from', unit: DIRECTION_UNIT, hint: '1 to 360' },
    { control: 'windSpeed', label: 'Wind speed', unit: 'kt', hint: `0 to ${MAX_WIND_KT}` },
    { control: 'windGust', label: 'Gusts', unit: 'kt', hint: 'Optional; at least the wind speed' },
  ] as const;
  private readonly windFields = {
    departure: this.windControls.map((field) => ({ ...field, path: `departure.${field.control}` as FormFieldPath })),
    arrival: this.windControls.map((field) => ({ ...field, path: `arrival.${field.control}` as FormFieldPath })),
  };

  /** The wind fields of `where`, each with its form path. */
  protected windFieldsOf(where: 'departure' | 'arrival') {
    return this.windFields[where];
  }

  /** What the wind at `where` is for, in one sentence. */
  protected windUse(where: 'departure' | 'arrival'): string {
    return where === 'arrival' || !this.model.form.controls.hasArrival.value
      ? 'Gives the headwind and crosswind and, by your operator’s additive policy, the approach speed.'
      : 'Gives the headwind and crosswind for the takeoff.';
  }
}
