/**
 * Load factor and stall speed in a level, coordinated turn: n = 1 / cos(bank) and
 * Vs(turn) = Vs·√n (FAA Airplane Flying Handbook and Pilot's Handbook of Aeronautical
 * Knowledge, load factor in turns: +7 % at 30°, +19 % at 45°, +41 % at 60°).
 */
import { AeroInputError } from './errors';
import { finiteResult, formatNumber, requireFinite, requirePositiveSpeed } from './guards';

const DEGREES_TO_RADIANS = Math.PI / 180;

function requireBankDeg(bankDeg: number): void {
  requireFinite(bankDeg, 'bankDeg', 'The bank angle');
  if (bankDeg < 0 || bankDeg >= 90) {
    throw new AeroInputError(
      'bank-out-of-range',
      'bankDeg',
      `A bank angle of ${formatNumber(bankDeg, 1)}° is not a level turn; give 0° or more and less than 90°.`,
    );
  }
}

/**
 * Load factor, g, of a level coordinated turn at `bankDeg`: n = 1 / cos(bank) (FAA PHAK).
 *
 * @param bankDeg bank angle, degrees, 0 or more and below 90
 * @example loadFactorInTurn(60) // 2
 * @throws AeroInputError `not-a-number`, `bank-out-of-range`
 */
export function loadFactorInTurn(bankDeg: number): number {
  requireBankDeg(bankDeg);
  return 1 / Math.cos(bankDeg * DEGREES_TO_RADIANS);
}

/**
 * Stall speed, kt, in a level coordinated turn at `bankDeg` of an aircraft whose wings-level
 * stall speed is `stallSpeedKt`: Vs·√n with n = 1 / cos(bank) (FAA Airplane Flying Handbook).
 *
 * @param stallSpeedKt wings-level stall speed, kt, above zero (at the card's weight)
 * @param bankDeg bank angle, degrees, 0 or more and below 90
 * @example stallSpeedInTurnKt(50, 60) // 70.71
 * @throws AeroInputError `not-a-number`, `speed-not-positive`, `bank-out-of-range`, `result-out-of-range`
 */
export function stallSpeedInTurnKt(stallSpeedKt: number, bankDeg: number): number {
  requirePositiveSpeed(stallSpeedKt, 'stallSpeedKt', 'The stall speed');
  return finiteResult(stallSpeedKt * Math.sqrt(loadFactorInTurn(bankDeg)), 'stallSpeedKt', 'a stall speed in the turn');
}
