import { Injectable } from '@angular/core';
import { SpeedwrightDeviceDatabase } from './device-database';

export * from './device-database';

/** The device store, one per app; tests replace it with a fresh database of another name. */
@Injectable({ providedIn: 'root' })
export class DeviceStore {
  readonly db = new SpeedwrightDeviceDatabase();
}
