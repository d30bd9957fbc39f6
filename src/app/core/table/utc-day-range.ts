/** The sentence shown when a date filter's ends are the wrong way round. */
export const DAY_ORDER_PROBLEM = 'The “from” date is after the “to” date. Change one of them.';

/** A date filter as the server's query: instants, both ends included. */
export interface UtcInstantRange {
  readonly from?: string;
  readonly to?: string;
}

/**
 * A "from"/"to" pair of `<input type="date">` values (YYYY-MM-DD, either may be empty) as
 * whole UTC days, the "to" day included; null when "from" is after "to". ISO dates compare
 * as strings in calendar order (ISO 8601 calendar date, extended format).
 */
export function utcDayRange(from: string, to: string): UtcInstantRange | null {
  if (from && to && from > to) return null;
  return {
    from: from ? `${from}T00:00:00.000Z` : undefined,
    to: to ? `${to}T23:59:59.999Z` : undefined,
  };
}
