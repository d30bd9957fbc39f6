import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import { ListTable } from '../core/table/list-table';
import { ListSort } from '../core/table/list-sort';
import { ListTableRow, ListTableState } from '../core/table/list-table-state';

interface AirframeRow extends ListTableRow {
  readonly airframe: AirframeView;
  readonly registration: string;
  readonly serial: string;
  readonly typeLabel: string;
  readonly active: boolean;
}

/** The operator's airframes: filter, sort, page, and (for administrators) edit. */
@Component({
  selector: 'sw-airframes-table',
  imports: [MatTableModule, MatSortModule, ListTable, ListSort, MatIconModule, MatButtonModule],
  templateUrl: './airframes-table.html',
  styleUrl: './fleet-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AirframesTable {
  readonly airframes = input.required<readonly AirframeView[]>();
  readonly aircraftTypes = input.required<readonly AircraftTypeView[]>();
  readonly canEdit = input(false);
  readonly editAirframe = output<AirframeView>();

  protected readonly columns = computed(() => [
    'registration',
    'serial',
    'type',
    'active',
    ...(this.canEdit() ? ['actions'] : []),
  ]);
  private readonly rows = computed<readonly AirframeRow[]>(() => {
    const types = new Map(this.aircraftTypes().map((type) => [type.id, type]));
    return this.airframes().map((airframe) => toRow(airframe, types.get(airframe.aircraftTypeId)));
  });
  protected readonly table = new ListTableState(this.rows, { active: 'registration', direction: 'asc' });
  protected readonly countSentence = computed(() => this.table.countSentence('airframe', 'airframes'));
}

function toRow(airframe: AirframeView, type: AircraftTypeView | undefined): AirframeRow {
  const typeLabel = type ? `${type.designator} · ${type.name}` : 'Unknown type';
  const activeLabel = airframe.active ? 'active' : 'inactive';
  return {
    id: airframe.id,
    airframe,
    registration: airframe.registration,
    serial: airframe.serial,
    typeLabel,
    active: airframe.active,
    searchText: [airframe.registration, airframe.serial, typeLabel, activeLabel].join(' ').toLowerCase(),
    sortKeys: { registration: airframe.registration, serial: airframe.serial, type: typeLabel, active: airframe.active ? 0 : 1 },
  };
}
