/**
 * The book's limit speeds on the card: each given in the book's indicator-marking basis, taken
 * both ways through its configuration's position-error table (CAS ↔ IAS), rounded down as
 * limits are (VMC up, VYSE nearest); MMO to 0.001 down; the crossover of VMO and MMO by the
 * pitot–static relations of NASA RP 1046. They depend on nothing of the day.
 */
import * as aero from '../aero';
import type { Configuration, RevisionContent, SpeedBasis } from '../speed-book/revision-content';
import type { CardFlapLimit, CardLimitSpeed, CardLimits } from './card';
import { guarded } from './card-refusal';
import { floorMach3, roundFt } from './card-rounding';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const { casToIasKt, crossoverAltitudeFt, iasToCasKt, roundLimitKt, roundSpeedKt, roundStallKt } = aero;

/** The card's limits, with the unrounded figures the ordering rules and the altitude table read. */
export interface ComputedLimits {
  readonly card: CardLimits;
  readonly crossoverFt: number | null;
  /** Unrounded CAS of VMC (for the ordering rules). */
  readonly vmcCasKt: number | null;
  /** Unrounded CAS of VMO, VNE (for the altitude table's limit column). */
  readonly vmoCasKt: number | null;
  readonly vneCasKt: number | null;
  readonly mmo: number | null;
}

/** The limits of `content` (read once per book: `SpeedBook.limits()`). */
export function readLimits(content: RevisionContent): ComputedLimits {
  const { limits, indicatorMarkingBasis: basis, configurations } = content;
  const cruise = configurations[0];
  const vmc = limits.vmcKt === undefined ? null : limitSpeed('VMC', limits.vmcKt, cruise, basis, roundStallKt);
  const vfe: CardFlapLimit[] = [];
  for (const configuration of configurations) {
    const valueKt = limits.vfeKt[configuration.key];
    if (valueKt === undefined) continue;
    const { casKt, iasKt } = limitSpeed('VFE', valueKt, configuration, basis).card;
    vfe.push({ casKt, configurationKey: configuration.key, configurationLabel: configuration.label, iasKt });
  }
  const vmo = limits.vmoKt === undefined ? null : limitSpeed('VMO', limits.vmoKt, cruise, basis);
  const vne = limits.vneKt === undefined ? null : limitSpeed('VNE', limits.vneKt, cruise, basis);
  const mmo = limits.mmo ?? null;
  const crossoverFt =
    vmo && mmo !== null ? roundFt(guarded(() => crossoverAltitudeFt(vmo.casKt, mmo), () => 'revision', 'VMO and MMO: ')) : null;
  const optional = (code: string, valueKt: number | undefined, round = roundLimitKt) =>
    valueKt === undefined ? null : limitSpeed(code, valueKt, cruise, basis, round).card;
  return {
    card: {
      basis,
      mmo: mmo === null ? null : floorMach3(mmo),
      vfe,
      vle: optional('VLE', limits.vleKt),
      vlo: optional('VLO', limits.vloKt),
      // VMC is a minimum: rounding it down would promise control below it, so it is rounded
      // up like a stall speed (the reason limits are rounded down, turned the other way).
      vmc: vmc?.card ?? null,
      vmo: vmo?.card ?? null,
      vne: vne?.card ?? null,
      vno: optional('VNO', limits.vnoKt),
      // VYSE is a target speed, not a limit: nearest knot.
      vyse: optional('VYSE', limits.vyseKt, roundSpeedKt),
    },
    crossoverFt,
    vmcCasKt: vmc?.casKt ?? null,
    vmoCasKt: vmo?.casKt ?? null,
    vneCasKt: vne?.casKt ?? null,
    mmo,
  };
}

/** A limit speed given in `basis`, both ways through `configuration`'s table, rounded by `round`. */
function limitSpeed(
  code: string,
  valueKt: number,
  configuration: Configuration,
  basis: SpeedBasis,
  round: (kt: number) => number = roundLimitKt,
): { card: CardLimitSpeed; casKt: number } {
  return guarded(
    () => {
      const table = configuration.positionError;
      const casKt = basis === 'cas' ? valueKt : iasToCasKt(table, valueKt);
      const iasKt = basis === 'ias' ? valueKt : casToIasKt(table, valueKt);
      return { casKt, card: { casKt: round(casKt), iasKt: round(iasKt) } };
    },
    () => 'revision',
    `${code} through the ${configuration.label} position-error table: `,
  );
}
