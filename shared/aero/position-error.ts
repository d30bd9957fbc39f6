/**
 * IAS ↔ CAS through a configuration's position-error table (flight-manual airspeed calibration,
 * instrument error included), by linear interpolation between the tabulated points as the
 * flight manual's own chart is read (FAA Pilot's Handbook of Aeronautical Knowledge, "airspeed
 * calibration"; NASA RP 1046 on position error). Never extrapolated.
 */
import { AeroInputError } from './errors';
import * as guards from './guards';
import * as interpolation from './interpolation';
import type { AxisPosition } from './interpolation';

// Imports are bound to module constants once, at load: the CommonJS output of esbuild (used by
// tsx, which runs the benchmark) reads every imported name through a getter on each use, which
// made those reads the bulk of a conversion's time. tsc and the Angular bundler are unaffected.
const { formatNumber } = guards;
const requirePositiveSpeed: typeof guards.requirePositiveSpeed = guards.requirePositiveSpeed;
const { EDGE_TOLERANCE, mix } = interpolation;

/** One calibration point: at indicated airspeed `iasKt` the calibrated airspeed is `casKt`. */
export interface PositionErrorPoint {
  readonly iasKt: number;
  readonly casKt: number;
}

/**
 * A configuration's calibration: at least two points, strictly increasing in both IAS and CAS,
 * all speeds finite and above zero.
 */
export type PositionErrorTable = readonly PositionErrorPoint[];

function isSpeed(value: unknown): boolean {
  return typeof value === 'number' && Number.isFinite(value) && value > 0;
}

function invalid(field: string, message: string): AeroInputError {
  return new AeroInputError('invalid-table', field, `The position-error table is not usable: ${message}`);
}

/**
 * Checks a position-error table and throws `invalid-table` with the first problem found (fewer
 * than two points, a speed that is missing, not above zero, or not strictly above the previous
 * point's). Use it to validate a table once, e.g. when a revision is entered.
 *
 * @param table points `{ iasKt, casKt }` in kt
 * @example checkPositionErrorTable([{ iasKt: 50, casKt: 54 }, { iasKt: 100, casKt: 101 }]) // passes
 * @throws AeroInputError `invalid-table`
 */
export function checkPositionErrorTable(table: PositionErrorTable): void {
  if (!Array.isArray(table) || table.length < 2) {
    throw invalid('positionErrorTable', 'it needs at least two IAS/CAS points.');
  }
  // Fast path, run on every lookup: one pass of comparisons that every valid table passes
  // (NaN fails them all). Anything else is examined again below to name the problem.
  let previousIasKt = 0;
  let previousCasKt = 0;
  for (let i = 0; i < table.length; i++) {
    const point = table[i];
    if (typeof point !== 'object' || point === null) explainBadPoint(table, i);
    const iasKt = point.iasKt;
    const casKt = point.casKt;
    if (
      !(typeof iasKt === 'number' && typeof casKt === 'number' && iasKt > previousIasKt && casKt > previousCasKt) ||
      !(iasKt < Infinity && casKt < Infinity)
    ) {
      explainBadPoint(table, i);
    }
    previousIasKt = iasKt;
    previousCasKt = casKt;
  }
}

/** Throws `invalid-table` naming what is wrong with point `i` (which failed the fast check). */
function explainBadPoint(table: PositionErrorTable, i: number): never {
  const point: unknown = table[i];
  if (typeof point !== 'object' || point === null) throw invalid(`positionErrorTable[${i}]`, `point ${i + 1} is not an IAS/CAS pair.`);
  const { iasKt, casKt } = point as PositionErrorPoint;
  if (!isSpeed(iasKt)) throw invalid(`positionErrorTable[${i}].iasKt`, `point ${i + 1} has an IAS that is not a speed above zero.`);
  if (!isSpeed(casKt)) throw invalid(`positionErrorTable[${i}].casKt`, `point ${i + 1} has a CAS that is not a speed above zero.`);
  const previous = table[i - 1];
  throw invalid(
    `positionErrorTable[${i}]`,
    `point ${i + 1} (${formatNumber(iasKt, 1)} KIAS, ${formatNumber(casKt, 1)} KCAS) does not rise strictly above ` +
      `point ${i} (${formatNumber(previous.iasKt, 1)} KIAS, ${formatNumber(previous.casKt, 1)} KCAS).`,
  );
}

/** Reused scratch for `locate`, so a lookup allocates nothing (the library is synchronous). */
const position: AxisPosition = { index: 0, t: 0 };

/**
 * `interpolation.locate` specialised to a column of the table, without a callback: the lookup
 * runs once per row of a card's altitude table.
 */
function locatePoint(table: PositionErrorTable, column: 'iasKt' | 'casKt', x: number): boolean {
  const last = table.length - 1;
  const first = table[0][column];
  const end = table[last][column];
  const slack = (end - first) * EDGE_TOLERANCE;
  if (!(x >= first - slack && x <= end + slack)) return false;
  const clamped = x < first ? first : x > end ? end : x;
  let low = 0;
  let high = last;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (table[middle][column] <= clamped) low = middle;
    else high = middle;
  }
  const x0 = table[low][column];
  const x1 = table[high][column];
  position.index = low;
  position.t = clamped === x1 ? 1 : (clamped - x0) / (x1 - x0);
  return true;
}

function convert(table: PositionErrorTable, speedKt: number, from: 'iasKt' | 'casKt', to: 'iasKt' | 'casKt'): number {
  checkPositionErrorTable(table);
  requirePositiveSpeed(speedKt, from, from === 'iasKt' ? 'The indicated airspeed' : 'The calibrated airspeed');
  if (!locatePoint(table, from, speedKt)) {
    const unit = from === 'iasKt' ? 'KIAS' : 'KCAS';
    throw new AeroInputError(
      'outside-table',
      from,
      `${formatNumber(speedKt, 1)} ${unit} is outside this configuration's position-error table ` +
        `(${formatNumber(table[0][from], 1)} to ${formatNumber(table[table.length - 1][from], 1)} ${unit}); ` +
        `the flight manual gives no correction there.`,
    );
  }
  return mix(table[position.index][to], table[position.index + 1][to], position.t);
}

/**
 * Calibrated airspeed, kt, for an indicated airspeed, by linear interpolation in the
 * configuration's position-error table. Method: flight-manual airspeed calibration (FAA PHAK,
 * NASA RP 1046), read linearly between points; never extrapolated.
 *
 * @param positionErrorTable the configuration's points, strictly increasing (see `checkPositionErrorTable`)
 * @param iasKt indicated airspeed, kt, within the table's IAS range
 * @example iasToCasKt([{ iasKt: 60, casKt: 63 }, { iasKt: 100, casKt: 101 }], 80) // 82
 * @throws AeroInputError `invalid-table`, `not-a-number`, `speed-not-positive`, `outside-table`
 */
export function iasToCasKt(positionErrorTable: PositionErrorTable, iasKt: number): number {
  return convert(positionErrorTable, iasKt, 'iasKt', 'casKt');
}

/**
 * Indicated airspeed, kt, for a calibrated airspeed: the inverse of `iasToCasKt` through the same
 * table (possible because it increases strictly in both columns). Never extrapolated.
 *
 * @param positionErrorTable the configuration's points, strictly increasing
 * @param casKt calibrated airspeed, kt, within the table's CAS range
 * @example casToIasKt([{ iasKt: 60, casKt: 63 }, { iasKt: 100, casKt: 101 }], 82) // 80
 * @throws AeroInputError `invalid-table`, `not-a-number`, `speed-not-positive`, `outside-table`
 */
export function casToIasKt(positionErrorTable: PositionErrorTable, casKt: number): number {
  return convert(positionErrorTable, casKt, 'casKt', 'iasKt');
}
