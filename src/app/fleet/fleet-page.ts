import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { forkJoin } from 'rxjs';
import { AircraftTypeView, AirframeView } from '../../../shared/api/fleet';
import { userMay } from '../core/auth/user-may';
import { requestState } from '../core/api/request-state';
import { AircraftTypeDialog, AircraftTypeDialogData } from './aircraft-type-dialog';
import { AircraftTypesTable } from './aircraft-types-table';
import { AirframeDialog, AirframeDialogData } from './airframe-dialog';
import { AirframesTable } from './airframes-table';
import { FleetRecords } from './fleet-records';
import { ProblemRetry } from '../core/feedback/problem-retry';

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
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

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
    this.dialog
      .open<AirframeDialog, AirframeDialogData, AirframeView>(AirframeDialog, { data, autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((saved) => {
        if (!saved) return;
        this.airframes.update((list) => replaceOrAppend(list, saved));
        this.snackBar.open(data.airframe ? `${saved.registration} is saved.` : `${saved.registration} is now in your fleet.`, 'Close', {
          duration: 5000,
        });
      });
  }

  private openAircraftTypeDialog(data: AircraftTypeDialogData): void {
    this.dialog
      .open<AircraftTypeDialog, AircraftTypeDialogData, AircraftTypeView>(AircraftTypeDialog, { data, autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((saved) => {
        if (!saved) return;
        this.aircraftTypes.update((list) => replaceOrAppend(list, saved));
        this.snackBar.open(data.aircraftType ? `${saved.designator} is saved.` : `${saved.designator} is now one of your types.`, 'Close', {
          duration: 5000,
        });
      });
  }
}

function replaceOrAppend<T extends { id: number }>(list: readonly T[], saved: T): readonly T[] {
  return list.some((item) => item.id === saved.id) ? list.map((item) => (item.id === saved.id ? saved : item)) : [...list, saved];
}
