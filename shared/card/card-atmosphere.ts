/**
 * The atmosphere of the day at an aerodrome: pressure altitude from elevation and QNH by the
 * ISA altimeter relation, ISA deviation, and density altitude with the virtual temperature
 * (flight-physics.md, "Altimetry"; the library's, shared/aero).
 */
import * as aero from '../aero';
import { AeroInputError } from '../aero';
import type { AerodromeConditions, CardAerodrome } from './card';
import { guarded } from './card-refusal';
import { round1, roundFt } from './card-rounding';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const { densityAltitudeFt, isaDeviationC, pressureAltitudeFt } = aero;

/**
 * The card cautions about density altitude from 5,000 ft, or from 2,000 ft above the field's
 * elevation. The product's own thresholds (no outside source): where takeoff and climb
 * performance falls off noticeably for light aircraft (common practice).
 */
export const HIGH_DENSITY_ALTITUDE_FT = 5000;
export const HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT = 2000;

/** An aerodrome of the day: the unrounded figures the speeds use, and the card's rounded ones. */
export interface Aerodrome {
  readonly pressureAltitudeFt: number;
  readonly oatC: number;
  readonly card: CardAerodrome;
}

const AERODROME_FIELDS = new Set(['elevationFt', 'qnhHpa', 'oatC', 'dewPointC']);

/** The day at `where`; refuses the card at the aerodrome's field when it leaves the modelled atmosphere. */
export function aerodrome(conditions: AerodromeConditions, where: 'departure' | 'arrival'): Aerodrome {
  const fieldOf = (field: string) => `${where}.${AERODROME_FIELDS.has(field) ? field : 'elevationFt'}`;
  return guarded(
    () => {
      const { elevationFt, qnhHpa, oatC, dewPointC } = conditions;
      const pressureFt = pressureAltitudeFt(elevationFt, qnhHpa);
      const deviationC = isaDeviationC(pressureFt, oatC);
      const densityFt = densityAltitudeOrNull(pressureFt, oatC, dewPointC);
      return {
        pressureAltitudeFt: pressureFt,
        oatC,
        card: {
          densityAltitudeFt: densityFt === null ? null : roundFt(densityFt),
          highDensityAltitude: densityFt !== null && (densityFt >= HIGH_DENSITY_ALTITUDE_FT || densityFt - elevationFt >= HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT),
          isaDeviationC: round1(deviationC),
          pressureAltitudeFt: roundFt(pressureFt),
        },
      };
    },
    fieldOf,
    where === 'departure' ? 'Departure: ' : 'Arrival: ',
  );
}

/**
 * Density altitude feeds no speed: a figure, never a reason to refuse (issue 11). With the
 * atmosphere down to −5 km no ordinary day leaves the model; a day that still does (denser air
 * than ISA at −5 km) shows no figure. A dew point above the air temperature is still refused
 * (a typing error the pilot must see).
 */
function densityAltitudeOrNull(pressureFt: number, oatC: number, dewPointC: number | undefined): number | null {
  try {
    return densityAltitudeFt(pressureFt, oatC, dewPointC);
  } catch (error) {
    if (error instanceof AeroInputError && error.code === 'altitude-out-of-range') return null;
    throw error;
  }
}
