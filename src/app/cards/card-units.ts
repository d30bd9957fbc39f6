import { Injectable, inject } from '@angular/core';
import { DOCUMENT } from '@angular/common';
import { cToF, fToC, ftToM, hpaToInhg, inhgToHpa, kgToLb, kmhToKt, ktToKmh, lbToKg, mToFt } from '@shared/aero';

/** What a form field measures; each kind offers the canonical unit and one other. */
export type Quantity = 'speed' | 'length' | 'pressure' | 'mass' | 'temperature' | 'temperatureDifference';

export const UNITS = {
  speed: ['kt', 'km/h'],
  length: ['ft', 'm'],
  pressure: ['hPa', 'inHg'],
  mass: ['kg', 'lb'],
  temperature: ['°C', '°F'],
  temperatureDifference: ['°C', '°F'],
} as const satisfies Record<Quantity, readonly [string, string]>;

export type UnitOf<Q extends Quantity> = (typeof UNITS)[Q][number];
export type AnyUnit = UnitOf<Quantity>;

/** The numeric fields of the card form, each with its own unit choice. */
export const UNIT_FIELDS = {
  weight: 'mass',
  landingWeight: 'mass',
  departureElevation: 'length',
  departureQnh: 'pressure',
  departureOat: 'temperature',
  departureDewPoint: 'temperature',
  arrivalElevation: 'length',
  arrivalQnh: 'pressure',
  arrivalOat: 'temperature',
  arrivalDewPoint: 'temperature',
  isaDeviation: 'temperatureDifference',
  cruiseIas: 'speed',
} as const satisfies Record<string, Quantity>;

export type UnitField = keyof typeof UNIT_FIELDS;
export type UnitChoice = { readonly [F in UnitField]: UnitOf<(typeof UNIT_FIELDS)[F]> };

/** The canonical unit of every field: what `CardInputs` holds. */
export const CANONICAL_UNITS: UnitChoice = {
  weight: 'kg',
  landingWeight: 'kg',
  departureElevation: 'ft',
  departureQnh: 'hPa',
  departureOat: '°C',
  departureDewPoint: '°C',
  arrivalElevation: 'ft',
  arrivalQnh: 'hPa',
  arrivalOat: '°C',
  arrivalDewPoint: '°C',
  isaDeviation: '°C',
  cruiseIas: 'kt',
};

/** A temperature difference scales by 9/5 with no offset (the Fahrenheit degree is 5/9 of a kelvin, by definition). */
const F_PER_C_DIFFERENCE = 9 / 5;

/**
 * `value` in `unit` to the field's canonical unit (kt, ft, hPa, kg, °C), with the
 * flight-physics library's conversions (which throw on values that are not finite).
 */
export function toCanonical(unit: AnyUnit, value: number, quantity: Quantity): number {
  switch (unit) {
    case 'km/h':
      return kmhToKt(value);
    case 'm':
      return mToFt(value);
    case 'inHg':
      return inhgToHpa(value);
    case 'lb':
      return lbToKg(value);
    case '°F':
      return quantity === 'temperatureDifference' ? value / F_PER_C_DIFFERENCE : fToC(value);
    default:
      return value;
  }
}

/** A canonical value (kt, ft, hPa, kg, °C) in `unit`. */
export function fromCanonical(unit: AnyUnit, value: number, quantity: Quantity): number {
  switch (unit) {
    case 'km/h':
      return ktToKmh(value);
    case 'm':
      return ftToM(value);
    case 'inHg':
      return hpaToInhg(value);
    case 'lb':
      return kgToLb(value);
    case '°F':
      return quantity === 'temperatureDifference' ? value * F_PER_C_DIFFERENCE : cToF(value);
    default:
      return value;
  }
}

/** How many decimals a value typed or shown in `unit` needs (inHg to the hundredth, as altimeters set it). */
export const UNIT_DECIMALS: Readonly<Record<AnyUnit, number>> = {
  kt: 0,
  'km/h': 0,
  ft: 0,
  m: 0,
  hPa: 1,
  inHg: 2,
  kg: 0,
  lb: 0,
  '°C': 1,
  '°F': 1,
};

/** `value` with at most the unit's decimals, trailing zeros dropped, a point as separator. */
export function formatInUnit(unit: AnyUnit, value: number): string {
  const decimals = UNIT_DECIMALS[unit];
  const factor = 10 ** decimals;
  const rounded = Math.round(value * factor) / factor + 0;
  return String(rounded);
}

export function otherUnit<Q extends Quantity>(quantity: Q, unit: UnitOf<Q>): UnitOf<Q> {
  const [first, second] = UNITS[quantity];
  return (unit === first ? second : first) as UnitOf<Q>;
}

const STORAGE_PREFIX = 'speedwright.card-units.';

/**
 * The units each person chose per field, remembered on this device (localStorage, keyed by user
 * id, so two pilots sharing a tablet keep their own).
 */
@Injectable({ providedIn: 'root' })
export class UnitPreferences {
  private readonly window = inject(DOCUMENT).defaultView;

  /** The person's choice, canonical units where they chose nothing or the stored value is unknown. */
  load(userId: number): UnitChoice {
    const stored = this.read(userId);
    const choice: Record<string, string> = { ...CANONICAL_UNITS };
    for (const field of Object.keys(UNIT_FIELDS) as UnitField[]) {
      const unit = stored?.[field];
      if (typeof unit === 'string' && (UNITS[UNIT_FIELDS[field]] as readonly string[]).includes(unit)) choice[field] = unit;
    }
    return choice as unknown as UnitChoice;
  }

  save(userId: number, choice: UnitChoice): void {
    try {
      this.window?.localStorage.setItem(STORAGE_PREFIX + userId, JSON.stringify(choice));
    } catch {
      // Storage full or blocked: the choice holds for this visit.
    }
  }

  private read(userId: number): Record<string, unknown> | null {
    try {
      const text = this.window?.localStorage.getItem(STORAGE_PREFIX + userId);
      const value: unknown = text ? JSON.parse(text) : null;
      return value && typeof value === 'object' ? (value as Record<string, unknown>) : null;
    } catch {
      return null;
    }
  }
}
