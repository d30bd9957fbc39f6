/**
 * The altitude table: the planned cruise from 0 ft every step up to the ceiling on the day's ISA
 * deviation — CAS/EAS/TAS/Mach by the pitot–static relations of NASA RP 1046 — beside the
 * limit of that altitude (VMO or MMO, whichever is lower in CAS; else VNE). A row the table or
 * the atmosphere cannot give shows dashes with the reason; nothing is extrapolated.
 */
import * as aero from '../aero';
import { AeroInputError } from '../aero';
import type { CardAltitudeRow, CardInputs, CardLimitKind } from './card';
import { iasWithinTable, type ComputedCruise } from './card-cruise';
import type { ComputedLimits } from './card-limits';
import { guarded } from './card-refusal';
import { group, round1, round3 } from './card-rounding';
import type { SpeedBook } from './speed-book-reader';

// Bound once (see shared/aero/airspeed.ts: tsx's CommonJS output reads imported names through
// getters on every use).
const { convertAirspeed, isaTemperatureC, roundLimitKt, roundSpeedKt } = aero;

/** Rows from 0 ft every `altitudeStepFt` below the ceiling, then the ceiling, on the day's ISA deviation. */
export function altitudeTable(book: SpeedBook, inputs: CardInputs, cruise: ComputedCruise, limits: ComputedLimits): CardAltitudeRow[] {
  const { ceilingFt } = book.content.aircraft;
  const rows: CardAltitudeRow[] = [];
  const cruiseField = cruise.casKt === null ? 'cruise.mach' : 'cruise.iasKt';
  const fieldOf = (field: string) => (field === 'oatC' || field === 'isaDeviationC' ? 'isaDeviationC' : cruiseField);
  for (let altitudeFt = 0; ; altitudeFt += inputs.altitudeStepFt) {
    const rowFt = Math.min(altitudeFt, ceilingFt);
    // A deviation that leaves even the surface row outside the atmosphere is a mistyped input:
    // the card is refused at that field. Aloft only, the rows concerned show a dash.
    const outside = rowFt === 0 ? null : outsideAtmosphereRow(rowFt, inputs, cruise);
    rows.push(outside ?? guarded(() => altitudeRow(book, rowFt, inputs, cruise, limits), fieldOf, `At ${group(rowFt)} ft: `));
    if (rowFt >= ceilingFt) break;
  }
  return rows;
}

/**
 * A row whose temperature on the day's ISA deviation lies outside the modelled atmosphere
 * (a cold surface day's deviation carried up to the ceiling gives −100 °C and below): every
 * figure is a dash, with the reason. The en-route table is no reason to refuse the takeoff and
 * landing speeds. Null for a row inside the atmosphere.
 */
function outsideAtmosphereRow(pressureAltitudeFt: number, inputs: CardInputs, cruise: ComputedCruise): CardAltitudeRow | null {
  try {
    isaTemperatureC(pressureAltitudeFt, inputs.isaDeviationC);
    return null;
  } catch (error) {
    if (!(error instanceof AeroInputError) || error.code !== 'temperature-out-of-range') throw error;
    const oatC = isaTemperatureC(pressureAltitudeFt, 0) + inputs.isaDeviationC;
    return {
      aboveLimit: false,
      casKt: null,
      cruiseNote: `At ${group(pressureAltitudeFt)} ft: ${error.message} No figure is given; check the en-route ISA deviation.`,
      easKt: null,
      iasKt: 'iasKt' in inputs.cruise && cruise.outsideTable === null ? inputs.cruise.iasKt : null,
      limitCasKt: null,
      limitIasKt: null,
      limitKind: null,
      mach: null,
      oatC: round1(oatC),
      pressureAltitudeFt,
      tasKt: null,
    };
  }
}

function altitudeRow(book: SpeedBook, pressureAltitudeFt: number, inputs: CardInputs, cruise: ComputedCruise, limits: ComputedLimits): CardAltitudeRow {
  const oatC = isaTemperatureC(pressureAltitudeFt, inputs.isaDeviationC);
  const machCruise = 'mach' in inputs.cruise ? inputs.cruise.mach : null;
  const speeds =
    machCruise !== null
      ? convertAirspeed({ pressureAltitudeFt, oatC, mach: machCruise })
      : cruise.casKt === null
        ? null
        : convertAirspeed({ pressureAltitudeFt, oatC, casKt: cruise.casKt });
  let cruiseNote: string | null = cruise.outsideTable;
  if (speeds && machCruise === null && speeds.mach >= 1) {
    cruiseNote = `At ${group(pressureAltitudeFt)} ft the cruise IAS of ${group(Math.round((inputs.cruise as { iasKt: number }).iasKt))} kt would be Mach ${round3(speeds.mach)}, at or above Mach 1; no figure is given.`;
  }
  const figures = cruiseNote === null ? speeds : null;
  const iasKt = machCruise !== null ? iasWithinTable(book.cruiseTable, speeds!.casKt, roundSpeedKt) : (inputs.cruise as { iasKt: number }).iasKt;
  if (machCruise !== null && iasKt === null) {
    cruiseNote = `At ${group(pressureAltitudeFt)} ft Mach ${machCruise} is ${roundSpeedKt(speeds!.casKt)} KCAS, outside the cruise configuration's position-error table: no IAS is given.`;
  }

  let limitCasKt: number | null = null;
  let limitKind: CardLimitKind | null = null;
  if (limits.vmoCasKt !== null) {
    limitCasKt = limits.vmoCasKt;
    limitKind = 'vmo';
    if (limits.mmo !== null) {
      const mmoCasKt = convertAirspeed({ pressureAltitudeFt, oatC, mach: limits.mmo }).casKt;
      if (mmoCasKt < limitCasKt) {
        limitCasKt = mmoCasKt;
        limitKind = 'mmo';
      }
    }
  } else if (limits.vneCasKt !== null) {
    limitCasKt = limits.vneCasKt;
    limitKind = 'vne';
  }
  return {
    aboveLimit: limitCasKt !== null && speeds !== null && speeds.casKt > limitCasKt + 1e-9,
    casKt: figures ? roundSpeedKt(figures.casKt) : null,
    cruiseNote,
    easKt: figures ? roundSpeedKt(figures.easKt) : null,
    iasKt,
    limitCasKt: limitCasKt === null ? null : roundLimitKt(limitCasKt),
    limitIasKt: limitCasKt === null ? null : iasWithinTable(book.cruiseTable, limitCasKt, roundLimitKt),
    limitKind,
    mach: figures ? round3(figures.mach) : null,
    oatC: round1(oatC),
    pressureAltitudeFt,
    tasKt: figures ? roundSpeedKt(figures.tasKt) : null,
  };
}
