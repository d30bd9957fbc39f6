/**
 * The points of the TAS/Mach-against-altitude picture: the planned cruise from the card's
 * altitude table, and the speed limit (VNE, VMO or MMO, whichever governs) at each row turned
 * into TAS and Mach with the flight-physics library. For the picture only; the card's figures
 * are the table's.
 */
import { AeroInputError, convertAirspeed } from '@shared/aero';
import type { SpeedCard } from '@shared/card';

export interface AltitudePoint {
  /** TAS in kt, or Mach. */
  readonly x: number;
  /** Pressure altitude, ft. */
  readonly y: number;
}

export interface AltitudeSeries {
  readonly cruiseTasKt: AltitudePoint[];
  readonly cruiseMach: AltitudePoint[];
  readonly limitTasKt: AltitudePoint[];
  readonly limitMach: AltitudePoint[];
  /** What the limit line is: "VNE", "VMO/MMO" or "VMO". */
  readonly limitName: string | null;
  readonly crossoverAltitudeFt: number | null;
}

export function altitudeSeries(card: SpeedCard): AltitudeSeries {
  const cruiseTasKt: AltitudePoint[] = [];
  const cruiseMach: AltitudePoint[] = [];
  const limitTasKt: AltitudePoint[] = [];
  const limitMach: AltitudePoint[] = [];
  for (const row of card.altitudeTable) {
    // A dashed row (cruiseNote) has no figure to draw: the line stops there, never drawn as NaN.
    if (row.tasKt !== null) cruiseTasKt.push({ x: row.tasKt, y: row.pressureAltitudeFt });
    if (row.mach !== null) cruiseMach.push({ x: row.mach, y: row.pressureAltitudeFt });
    if (row.limitCasKt === null) continue;
    try {
      const limit = convertAirspeed({ pressureAltitudeFt: row.pressureAltitudeFt, oatC: row.oatC, casKt: row.limitCasKt });
      limitTasKt.push({ x: Math.round(limit.tasKt), y: row.pressureAltitudeFt });
      limitMach.push({ x: Math.round(limit.mach * 1000) / 1000, y: row.pressureAltitudeFt });
    } catch (error) {
      // A limit the relations cannot carry at this row is left out of the picture, never drawn as NaN.
      if (!(error instanceof AeroInputError)) throw error;
    }
  }
  const { vmo, vne, mmo } = card.limits;
  const limitName = vmo ? (mmo !== null ? 'VMO/MMO' : 'VMO') : vne ? 'VNE' : null;
  return { cruiseTasKt, cruiseMach, limitTasKt, limitMach, limitName, crossoverAltitudeFt: card.crossoverAltitudeFt };
}
