import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import { AIRCRAFT_CATEGORY_LABELS } from './aircraft-category-labels';
import { ListTable } from '../core/table/list-table';
import { ListSort } from '../core/table/list-sort';
import { ListTableRow, ListTableState } from '../core/table/list-table-state';

interface AircraftTypeRow extends ListTableRow {
  readonly aircraftType: AircraftTypeView;
  readonly categoryLabel: string;
  readonly airframeCount: number;
}

/** The operator's aircraft types: filter, sort, page, and (for administrators) edit. */
@Component({
  selector: 'sw-aircraft-types-table',
  imports: [DecimalPipe, MatTableModule, MatSortModule, ListTable, ListSort, MatIconModule, MatButtonModule],
  templateUrl: './aircraft-types-table.html',
  styleUrl: './fleet-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AircraftTypesTable {
  readonly aircraftTypes = input.required<readonly AircraftTypeView[]>();
  readonly airframes = input.required<readonly AirframeView[]>();
  readonly canEdit = input(false);
  readonly editAircraftType = output<AircraftTypeView>();

  protected readonly columns = computed(() => [
    'designator',
    'name',
    'category',
    'engines',
    'ceilingFt',
    'airframes',
    ...(this.canEdit() ? ['actions'] : []),
  ]);
  private readonly rows = computed<readonly AircraftTypeRow[]>(() => {
    const counts = new Map<number, number>();
    for (const airframe of this.airframes()) counts.set(airframe.aircraftTypeId, (counts.get(airframe.aircraftTypeId) ?? 0) + 1);
    return this.aircraftTypes().map((type) => toRow(type, counts.get(type.id) ?? 0));
  });
  protected readonly table = new ListTableState(this.rows, { active: 'designator', direction: 'asc' });
  protected readonly countSentence = computed(() => this.table.countSentence('aircraft type', 'aircraft types'));
}

function toRow(type: AircraftTypeView, airframeCount: number): AircraftTypeRow {
  const categoryLabel = AIRCRAFT_CATEGORY_LABELS[type.category];
  return {
    id: type.id,
    aircraftType: type,
    categoryLabel,
    airframeCount,
    searchText: [type.designator, type.name, categoryLabel].join(' ').toLowerCase(),
    sortKeys: {
      designator: type.designator,
      name: type.name,
      category: categoryLabel,
      engines: type.engines,
      ceilingFt: type.ceilingFt,
      airframes: airframeCount,
    },
  };
}
