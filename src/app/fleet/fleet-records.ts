import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import {
  AircraftTypeView,
  AirframeView,
  CreateAircraftType,
  CreateAirframe,
  UpdateAircraftType,
  UpdateAirframe,
  aircraftTypeListSchema,
  aircraftTypeResponseSchema,
  airframeListSchema,
  airframeResponseSchema,
} from '@shared/api/fleet';
import { API_PATHS } from '../core/api/api-paths';
import { ApiClient } from '../core/api/api-client';

/** The operator's aircraft types and airframes: everyone reads them, administrators write them. */
@Injectable({ providedIn: 'root' })
export class FleetRecords {
  private readonly api = inject(ApiClient);

  aircraftTypes(): Observable<AircraftTypeView[]> {
    return this.api.get(API_PATHS.aircraftTypes, aircraftTypeListSchema).pipe(map(({ aircraftTypes }) => aircraftTypes));
  }

  airframes(): Observable<AirframeView[]> {
    return this.api.get(API_PATHS.airframes, airframeListSchema).pipe(map(({ airframes }) => airframes));
  }

  addAircraftType(type: CreateAircraftType): Observable<AircraftTypeView> {
    return this.api.post(API_PATHS.aircraftTypes, type, aircraftTypeResponseSchema).pipe(map(({ aircraftType }) => aircraftType));
  }

  changeAircraftType(id: number, change: UpdateAircraftType): Observable<AircraftTypeView> {
    return this.api
      .patch(`${API_PATHS.aircraftTypes}/${id}`, change, aircraftTypeResponseSchema)
      .pipe(map(({ aircraftType }) => aircraftType));
  }

  addAirframe(airframe: CreateAirframe): Observable<AirframeView> {
    return this.api.post(API_PATHS.airframes, airframe, airframeResponseSchema).pipe(map(({ airframe }) => airframe));
  }

  changeAirframe(id: number, change: UpdateAirframe): Observable<AirframeView> {
    return this.api.patch(`${API_PATHS.airframes}/${id}`, change, airframeResponseSchema).pipe(map(({ airframe }) => airframe));
  }
}
