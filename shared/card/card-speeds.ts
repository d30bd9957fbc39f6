/**
 * The card's V-speeds and the stall speeds in a level turn, from the speed book at the day's
 * weights and atmosphere:
 * - weight-scaled speeds V = Vref·√(W/Wref), applied to the calibrated airspeed (the lift at a
 *   fixed angle of attack follows the dynamic pressure, which CAS stands for at these speeds —
 *   common practice), then IAS through the configuration's position-error table;
 * - tabulated speeds read by linear interpolation, never extrapolated;
 * - stall speed in a level turn Vs·√n, n = 1/cos(bank);
 * - rounding as printed by the speed's class (flight-physics.md, "Rounding by kind").
 */
import * as aero from '../aero';
import type { PositionErrorTable, SpeedTable } from '../aero';
import { roundingOfClass, speedClassOf, speedRole } from '../speed-book/speed-class';
import type { Speed } from '../speed-book/revision-content';
import { STALL_TURN_BANKS_DEG, type CardInputs, type CardSpeed, type CardStallInTurn } from './card';
import type { Aerodrome } from './card-atmosphere';
import { guarded } from './card-refusal';
import { ROUNDERS, round2 } from './card-rounding';
import type { SpeedBook } from './speed-book-reader';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const { casToIasKt, iasToCasKt, interpolateSpeedTableKt, loadFactorInTurn, roundStallKt } = aero;

/** A speed of the card with its unrounded CAS, which the stall-in-turn lines start from. */
export interface ComputedSpeed {
  readonly card: CardSpeed;
  readonly casKt: number;
  readonly table: PositionErrorTable;
}

/**
 * The card's V-speeds: takeoff speeds of the takeoff configuration, every other speed as
 * published. With `only`, the speeds of that phase (and those of every phase, 'any').
 */
export function cardSpeeds(
  book: SpeedBook,
  inputs: CardInputs,
  landingWeightKg: number,
  takeoffKey: string | null,
  departure: Aerodrome,
  arrival: Aerodrome | null,
  only?: 'takeoff' | 'landing',
  landingKey?: string,
): ComputedSpeed[] {
  const result: ComputedSpeed[] = [];
  for (const speed of book.content.speeds) {
    if (speed.phase === 'takeoff' && speed.configurationKey !== takeoffKey) continue;
    const landing = speed.phase === 'landing' || speed.phase === 'approach';
    if (only === 'takeoff' && landing) continue;
    if (only === 'landing' && !landing && speed.phase !== 'any') continue;
    if (only === 'landing' && landing && landingKey !== undefined && speed.configurationKey !== landingKey) continue;
    result.push(computeSpeed(book, speed, inputs, landingWeightKg, departure, arrival));
  }
  return result;
}

/** Approach and landing speeds at the landing weight and arrival (when given). */
function computeSpeed(book: SpeedBook, speed: Speed, inputs: CardInputs, landingWeightKg: number, departure: Aerodrome, arrival: Aerodrome | null): ComputedSpeed {
  const configuration = book.byKey.get(speed.configurationKey)!;
  const table = configuration.positionError;
  const landing = speed.phase === 'landing' || speed.phase === 'approach';
  const weightField = landing && inputs.landingWeightKg !== undefined ? 'landingWeightKg' : 'weightKg';
  const weightKg = landing ? landingWeightKg : inputs.weightKg;
  const where = landing && arrival ? 'arrival' : 'departure';
  const atmosphere = where === 'arrival' ? arrival! : departure;
  const fieldOf = (field: string) =>
    field === 'pressureAltitudeFt' ? `${where}.elevationFt` : field === 'oatC' ? `${where}.oatC` : weightField;

  return guarded(
    () => {
      let casKt: number;
      if (speed.kind === 'scaled') {
        const referenceCasKt = speed.basis === 'ias' ? iasToCasKt(table, speed.referenceKt) : speed.referenceKt;
        casKt = referenceCasKt * Math.sqrt(weightKg / book.content.weights.referenceKg!);
      } else {
        const valueKt =
          speed.kind === 'fixed'
            ? speed.valueKt
            : interpolateSpeedTableKt(speed as unknown as SpeedTable, {
                weightKg,
                pressureAltitudeFt: atmosphere.pressureAltitudeFt,
                oatC: atmosphere.oatC,
              });
        casKt = speed.basis === 'ias' ? iasToCasKt(table, valueKt) : valueKt;
      }
      const iasKt = casToIasKt(table, casKt);
      const rounding = roundingOfClass(speedClassOf(speed));
      const round = ROUNDERS[rounding];
      return {
        casKt,
        table,
        card: {
          basis: speed.basis,
          casKt: round(casKt),
          code: speed.code,
          configurationKey: speed.configurationKey,
          configurationLabel: configuration.label,
          iasKt: round(iasKt),
          kind: speed.kind,
          label: speed.label,
          phase: speed.phase,
          rounding,
          weightKg,
        },
      };
    },
    fieldOf,
    `${speed.code} (${speed.label}): `,
  );
}

/**
 * Stall speed at each bank from VS1 (or VS) at the weight it was computed at, in its
 * configuration. A bank whose stall speed lies beyond the configuration's position-error
 * table has no line (its IAS would be an extrapolation); the card's other figures stand.
 */
export function stallInTurn(speeds: readonly ComputedSpeed[]): CardStallInTurn[] {
  const vs1 = speeds.find((speed) => speedRole(speed.card.code) === 'VS1') ?? speeds.find((speed) => speedRole(speed.card.code) === 'VS');
  if (!vs1) return [];
  const topCasKt = vs1.table[vs1.table.length - 1].casKt;
  const lines: CardStallInTurn[] = [];
  for (const bankDeg of STALL_TURN_BANKS_DEG) {
    const loadFactor = loadFactorInTurn(bankDeg);
    const casKt = vs1.casKt * Math.sqrt(loadFactor);
    if (casKt > topCasKt) break;
    lines.push(
      guarded(
        () => ({ bankDeg, casKt: roundStallKt(casKt), iasKt: roundStallKt(casToIasKt(vs1.table, casKt)), loadFactor: round2(loadFactor) }),
        () => 'weightKg',
        `${vs1.card.code} in a ${bankDeg}° bank: `,
      ),
    );
  }
  return lines;
}
