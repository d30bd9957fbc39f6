import { FormArray } from '@angular/forms';
import { numberControl } from './form-content';
import type { TableGroup } from './speed-form';

/** Grid editing of a tabulated speed: rows are weights, columns pressure altitudes, pages OATs. */
export class TableShape {
  constructor(private readonly table: TableGroup) {}

  private get c() {
    return this.table.controls;
  }

  addWeight(): void {
    const slots = this.c.values.at(0);
    this.c.weights.push(numberControl());
    this.c.values.push(new FormArray((slots?.controls ?? [null]).map((byOat) => new FormArray((byOat?.controls ?? [null]).map(() => numberControl())))));
  }

  removeWeight(w: number): void {
    this.c.weights.removeAt(w);
    this.c.values.removeAt(w);
  }

  addAltitude(): void {
    const first = this.c.altitudes.length === 0;
    this.c.altitudes.push(numberControl());
    if (first) return; // the single speed column becomes the first altitude's
    for (const byAltitude of this.c.values.controls) byAltitude.push(new FormArray(byAltitude.at(0).controls.map(() => numberControl())));
  }

  removeAltitude(a: number): void {
    this.c.altitudes.removeAt(a);
    if (this.c.altitudes.length === 0 && a === 0 && this.c.values.at(0)?.length === 1) return;
    for (const byAltitude of this.c.values.controls) if (byAltitude.length > 1) byAltitude.removeAt(a);
  }

  addOat(): void {
    const first = this.c.oats.length === 0;
    this.c.oats.push(numberControl());
    if (first) return;
    for (const byAltitude of this.c.values.controls) for (const byOat of byAltitude.controls) byOat.push(numberControl());
  }

  removeOat(o: number): void {
    this.c.oats.removeAt(o);
    for (const byAltitude of this.c.values.controls) for (const byOat of byAltitude.controls) if (byOat.length > 1) byOat.removeAt(o);
  }
}
