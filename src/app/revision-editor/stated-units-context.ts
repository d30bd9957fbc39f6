import { Injectable, signal } from '@angular/core';
import { CANONICAL_UNITS, type StatedUnits } from '@shared/speed-book/stated-units';

/**
 * The units the flight manual of the revision being edited prints, for every figure field of
 * the editor (`StatedUnitInput`) and its column headings. Provided by the revision editor;
 * without it figures are taken and shown in kg and kt.
 */
@Injectable()
export class StatedUnitsContext {
  readonly units = signal<StatedUnits>(CANONICAL_UNITS);
}
