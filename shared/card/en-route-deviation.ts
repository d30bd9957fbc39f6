/**
 * The en-route ISA deviation starts from the departure's own (the day's air mass), and a value
 * far from it asks the pilot to confirm: a typing slip (−30 for +30) would otherwise move every
 * TAS and Mach of the altitude table. The 20 °C threshold is the product's own (issue 11): day-to-
 * day deviations along a route rarely differ by that much (common practice, no outside source).
 */

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
