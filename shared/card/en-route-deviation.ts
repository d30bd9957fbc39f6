/**
 * The en-route ISA deviation starts from the departure's own (the day's air mass), and a value
 * far from it asks the pilot to confirm: a typing slip (−30 for +30) would otherwise move every
 * TAS and Mach of the altitude table. The 20 °C threshold is the product's own (issue 11): day-to-
 * day deviations along a route rarely differ by that much (common practice, no outside source).
 * A TAT reading at cruise gives the deviation aloft directly (`isaDeviationFromTat`).
 */
import { isaDeviationC, tatToSatC } from '../aero';

/** Differences above this, °C, between the en-route and the departure's ISA deviation ask for confirmation. */
export const EN_ROUTE_DEVIATION_CONFIRM_C = 20;

const signed = (value: number) => `${value >= 0 ? '+' : '−'}${Math.abs(Math.round(value))}`;

/**
 * The departure's ISA deviation as the en-route value to start from, whole °C.
 * @example startingEnRouteDeviationC(24.6) // 25
 */
export function startingEnRouteDeviationC(departureDeviationC: number): number {
  return Math.round(departureDeviationC) + 0;
}

/**
 * A sentence asking for confirmation when `enRouteDeviationC` differs from the departure's by
 * more than `EN_ROUTE_DEVIATION_CONFIRM_C`; null when it does not (or either is not a number).
 * @example enRouteDeviationCheck(25, -30) // "The en-route ISA deviation (ISA −30 °C) differs from …"
 */
export function enRouteDeviationCheck(departureDeviationC: number, enRouteDeviationC: number): string | null {
  if (!Number.isFinite(departureDeviationC) || !Number.isFinite(enRouteDeviationC)) return null;
  const difference = Math.abs(enRouteDeviationC - departureDeviationC);
  if (difference <= EN_ROUTE_DEVIATION_CONFIRM_C) return null;
  return (
    `The en-route ISA deviation (ISA ${signed(enRouteDeviationC)} °C) differs from the departure's (ISA ${signed(departureDeviationC)} °C) ` +
    `by ${Math.round(difference)} °C. Confirm it is the day's forecast before using the altitude table.`
  );
}

/** A total-air-temperature reading at a cruise altitude and Mach. */
export interface TatReading {
  readonly tatC: number;
  readonly pressureAltitudeFt: number;
  readonly mach: number;
  /** The probe's recovery factor K (the book's `aircraft.tatRecoveryFactor`); 1 when the book states none. */
  readonly recoveryFactor?: number;
}

/**
 * The static air temperature and ISA deviation of a TAT reading: SAT = TAT / (1 + 0.2·K·M²)
 * (shared/aero `tatToSatC`; NASA RP 1046), then SAT − ISA at the pressure altitude (ISO 2533).
 * @example isaDeviationFromTat({ tatC: -30, pressureAltitudeFt: 35000, mach: 0.78 }) // { satC: ≈ −56.4, isaDeviationC: ≈ −2.0 }
 * @throws AeroInputError for a reading outside the relations (supersonic, below absolute zero, …)
 */
export function isaDeviationFromTat(reading: TatReading): { satC: number; isaDeviationC: number } {
  const satC = tatToSatC(reading.tatC, reading.mach, reading.recoveryFactor ?? 1);
  return { satC, isaDeviationC: isaDeviationC(reading.pressureAltitudeFt, satC) };
}
