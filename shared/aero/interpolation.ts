/**
 * Linear interpolation on one axis, shared by the position-error and speed tables. Internal:
 * not part of the barrel. Tables are never extrapolated; only rounding noise at an end (a
 * billionth of the table's span, e.g. from a lb → kg conversion) is absorbed by clamping.
 */

/** Fraction of an axis's span beyond an end still treated as that end. */
export const EDGE_TOLERANCE = 1e-9;

/** Where a value falls on an axis: segment [index, index + 1] at fraction `t` ∈ [0, 1]. */
export interface AxisPosition {
  index: number;
  t: number;
}

/**
 * Locates `x` on the strictly increasing axis `valueAt(0) … valueAt(count − 1)` into `into`.
 * Returns false when `x` lies outside the axis (beyond the edge tolerance).
 */
export function locate(count: number, valueAt: (i: number) => number, x: number, into: AxisPosition): boolean {
  const first = valueAt(0);
  const last = valueAt(count - 1);
  const slack = (last - first) * EDGE_TOLERANCE;
  if (!(x >= first - slack && x <= last + slack)) return false;
  const clamped = x < first ? first : x > last ? last : x;
  let low = 0;
  let high = count - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (valueAt(middle) <= clamped) low = middle;
    else high = middle;
  }
  const x0 = valueAt(low);
  const x1 = valueAt(high);
  into.index = low;
  into.t = clamped === x1 ? 1 : (clamped - x0) / (x1 - x0);
  return true;
}

/** Linear blend of `y0` and `y1` at fraction `t`, exact at both ends. */
export function mix(y0: number, y1: number, t: number): number {
  return t === 0 ? y0 : t === 1 ? y1 : y0 + t * (y1 - y0);
}
