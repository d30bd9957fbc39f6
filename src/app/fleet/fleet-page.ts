import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { forkJoin } from 'rxjs';
import { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import { userMay } from '../core/auth/user-may';
import { requestState } from '../core/api/request-state';
import { AircraftTypeDialog, AircraftTypeDialogData } from './aircraft-type-dialog';
import { AircraftTypesTable } from './aircraft-types-table';
import { AirframeDialog, AirframeDialogData } from './airframe-dialog';
import { AirframesTable } from './airframes-table';
import { FleetRecords } from './fleet-records';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { formDialogs, withSavedRecord } from '../core/forms/form-dialogs';

/** The operator's airframes and aircraft types; administrators add and edit them here. */
@Component({
  selector: 'sw-fleet-page',
  imports: [ProblemRetry, MatTabsModule, MatButtonModule, MatIconModule, MatProgressBarModule, AirframesTable, AircraftTypesTable],
  templateUrl: './fleet-page.html',
  styleUrl: './fleet-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FleetPage {
  private readonly fleet = inject(FleetRecords);
  private readonly dialogs = formDialogs();

  protected readonly canManage = userMay('manage-fleet');
  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly aircraftTypes = signal<readonly AircraftTypeView[]>([]);
  protected readonly airframes = signal<readonly AirframeView[]>([]);

  constructor() {
    this.loadFleet();
  }

  protected loadFleet(): void {
    this.request.run(forkJoin({ aircraftTypes: this.fleet.aircraftTypes(), airframes: this.fleet.airframes() }), ({ aircraftTypes, airframes }) => {
      this.aircraftTypes.set(aircraftTypes);
      this.airframes.set(airframes);
    });
  }

  protected addAirframe(): void {
    this.openAirframeDialog({ aircraftTypes: this.aircraftTypes() });
  }

  protected editAirframe(airframe: AirframeView): void {
    this.openAirframeDialog({ airframe, aircraftTypes: this.aircraftTypes() });
  }

  protected addAircraftType(): void {
    this.openAircraftTypeDialog({});
  }

  protected editAircraftType(aircraftType: AircraftTypeView): void {
    this.openAircraftTypeDialog({ aircraftType });
  }

  private openAirframeDialog(data: AirframeDialogData): void {
    this.dialogs.open(AirframeDialog, data, (saved: AirframeView) => {
      this.airframes.update((list) => withSavedRecord(list, saved));
      this.dialogs.note(data.airframe ? `${saved.registration} is saved.` : `${saved.registration} is now in your fleet.`);
    });
  }

  private openAircraftTypeDialog(data: AircraftTypeDialogData): void {
    this.dialogs.open(AircraftTypeDialog, data, (saved: AircraftTypeView) => {
      this.aircraftTypes.update((list) => withSavedRecord(list, saved));
      this.dialogs.note(data.aircraftType ? `${saved.designator} is saved.` : `${saved.designator} is now one of your types.`);
    });
  }
}
