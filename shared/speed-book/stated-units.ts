/**
 * The flight manual's own units. A revision's content always stores weights in kg and speeds in
 * kt; `statedUnits` says which units the flight manual prints, so that the editor takes and
 * shows figures in them and the review names them beside the stored ones.
 *
 * Conversion factors are exact by definition: 1 lb = 0.453 592 37 kg and 1 mile = 1 609.344 m
 * (international yard and pound agreement, 1959), 1 nautical mile = 1 852 m (SI brochure, the
 * international nautical mile), 1 km/h = 1/3.6 m/s. They come from `shared/aero/units.ts`.
 *
 * Round trips: a figure entered in the stated unit with at most `STATED_DECIMALS` decimals is
 * shown again exactly as entered after it was stored canonical (the stored number is within a
 * few units in the last place of the exact conversion; the shown one is rounded to
 * `STATED_DECIMALS` places, far finer than that error and far coarser than any manual's figure).
 */
import { kgToLb, kmhToKt, ktToKmh, ktToMph, lbToKg, mphToKt } from '../aero/units';
import { STATED_SPEED_UNITS, STATED_WEIGHT_UNITS } from './content-shape';

export type StatedWeightUnit = (typeof STATED_WEIGHT_UNITS)[number];
export type StatedSpeedUnit = (typeof STATED_SPEED_UNITS)[number];
export interface StatedUnits {
  weight: StatedWeightUnit;
  speed: StatedSpeedUnit;
}
/** What a figure measures; only these two have stated units. */
export type StatedQuantity = 'weight' | 'speed';

/** The units content is stored in, and the stated units of a book that names none. */
export const CANONICAL_UNITS: Readonly<StatedUnits> = Object.freeze({ weight: 'kg', speed: 'kt' });

/** Decimals a stated figure is shown with at most (see the round-trip note above). */
export const STATED_DECIMALS = 4;

/** How each unit is written for a reader: km/h, not the key `kmh`. */
export const UNIT_SYMBOLS: Readonly<Record<StatedWeightUnit | StatedSpeedUnit, string>> = { kg: 'kg', lb: 'lb', kt: 'kt', mph: 'mph', kmh: 'km/h' };

/** The stated units of a content (any JSON, drafts included); kg and kt when it names none or names them wrongly. */
export function statedUnitsOf(content: unknown): StatedUnits {
  const stated = typeof content === 'object' && content !== null ? (content as Record<string, unknown>)['statedUnits'] : undefined;
  const units = typeof stated === 'object' && stated !== null ? (stated as Record<string, unknown>) : {};
  const weight = STATED_WEIGHT_UNITS.find((unit) => unit === units['weight']) ?? CANONICAL_UNITS.weight;
  const speed = STATED_SPEED_UNITS.find((unit) => unit === units['speed']) ?? CANONICAL_UNITS.speed;
  return { weight, speed };
}

/** True when the stated unit of `quantity` is the canonical one, so no conversion happens. */
export function isCanonical(quantity: StatedQuantity, units: StatedUnits): boolean {
  return units[quantity] === CANONICAL_UNITS[quantity];
}

/** The unit `quantity` is stated in, as a reader writes it (kg, lb, kt, mph, km/h). */
export function statedSymbol(quantity: StatedQuantity, units: StatedUnits): string {
  return UNIT_SYMBOLS[units[quantity]];
}

/** The canonical unit of `quantity` as a reader writes it (kg or kt). */
export function canonicalSymbol(quantity: StatedQuantity): string {
  return UNIT_SYMBOLS[CANONICAL_UNITS[quantity]];
}

/**
 * A figure in the stated unit → the stored figure (kg or kt), exactly converted, unrounded.
 * Canonical units pass the figure through untouched. Throws an `AeroInputError` on a non-finite figure.
 * @example toCanonical(161, 'speed', { weight: 'lb', speed: 'mph' }) // 139.906… kt
 */
export function toCanonical(figure: number, quantity: StatedQuantity, units: StatedUnits): number {
  if (quantity === 'weight') return units.weight === 'lb' ? lbToKg(figure) : figure;
  if (units.speed === 'mph') return mphToKt(figure);
  if (units.speed === 'kmh') return kmhToKt(figure);
  return figure;
}

/**
 * A stored figure (kg or kt) → the stated unit, rounded to `STATED_DECIMALS` places so that a
 * figure entered in that unit comes back as entered. Canonical units pass it through untouched.
 * @example fromCanonical(toCanonical(161, 'speed', mph), 'speed', mph) // 161
 */
export function fromCanonical(stored: number, quantity: StatedQuantity, units: StatedUnits): number {
  if (isCanonical(quantity, units)) return stored;
  const exact = quantity === 'weight' ? kgToLb(stored) : units.speed === 'mph' ? ktToMph(stored) : ktToKmh(stored);
  return roundTo(exact, STATED_DECIMALS);
}

/** Rounds half away from zero to `decimals` places via the decimal string, so 161.1234 stays the double 161.1234 parses to. */
export function roundTo(value: number, decimals: number): number {
  const rounded = Number(value.toFixed(decimals));
  return Object.is(rounded, -0) ? 0 : rounded;
}

/** A number as a reader writes it: at most `decimals` places, no trailing zeros, a plain minus. */
export function plainFigure(value: number, decimals: number): string {
  return String(roundTo(value, decimals));
}

/**
 * A stored figure named in the stated unit, with the stored one beside it when they differ, so
 * an approver compares the first with the page as printed.
 * @example describeFigure(139.906, 'speed', { weight: 'lb', speed: 'mph' }) // "161 mph (139.9 kt)"
 * @example describeFigure(140, 'speed', { weight: 'kg', speed: 'kt' }) // "140 kt"
 */
export function describeFigure(stored: number, quantity: StatedQuantity, units: StatedUnits): string {
  if (!Number.isFinite(stored)) return String(stored);
  const canonical = `${plainFigure(stored, isCanonical(quantity, units) ? STATED_DECIMALS : 1)} ${canonicalSymbol(quantity)}`;
  if (isCanonical(quantity, units)) return canonical;
  return `${plainFigure(fromCanonical(stored, quantity, units), STATED_DECIMALS)} ${statedSymbol(quantity, units)} (${canonical})`;
}

/** The quantity a content field holds, by our naming: `…Kt` a speed, `…Kg` a weight, else none. */
export function quantityOfField(name: string): StatedQuantity | null {
  if (/Kt$/.test(name)) return 'speed';
  if (/Kg$/.test(name)) return 'weight';
  return null;
}

/**
 * The quantity at a content path, in the schema's dotted form (`speeds.0.valuesKt.1.2`) or the
 * diff's keyed form (`configurations[clean].positionError.1.casKt`, `limits.vfeKt.landing-flap`).
 * List indexes and keys inherit the quantity of the field that holds them.
 */
export function quantityAtPath(path: string): StatedQuantity | null {
  const names = (path.match(/[^.[\]]+|\[[^\]]*\]/g) ?? []).filter((token) => !token.startsWith('[') && !/^\d+$/.test(token));
  const last = names.at(-1);
  if (last === undefined) return null;
  if (names.at(-2) === 'vfeKt') return 'speed'; // limits.vfeKt.<configuration key>
  return quantityOfField(last);
}

/**
 * A JSON value with every weight and speed replaced by `describeFigure`'s words, for showing a
 * whole added speed or a whole changed table. `quantity` is that of the value itself (a list of
 * speeds, say); record fields name their own. Depth is bounded by the content's own shape.
 */
export function describeFigures(value: unknown, quantity: StatedQuantity | null, units: StatedUnits, depth = 0): unknown {
  if (depth > 8) return value;
  if (typeof value === 'number') return quantity ? describeFigure(value, quantity, units) : value;
  if (Array.isArray(value)) return value.map((item) => describeFigures(item, quantity, units, depth + 1));
  if (typeof value === 'object' && value !== null) {
    return Object.fromEntries(
      Object.entries(value).map(([key, item]) => [key, describeFigures(item, quantity === 'speed' && key !== 'mmo' ? 'speed' : quantityOfField(key), units, depth + 1)]),
    );
  }
  return value;
}

/**
 * A sentence about stored figures ("55.4 kt", "1,100 kg"), with each figure restated in the
 * stated unit first and the stored one kept in brackets: "63.75 mph (55.4 kt)". Figures the
 * sentence rounded are restated to two decimals at most. Unchanged for kg and kt.
 * @example restateFigures('VNE 160 kt is above …', { weight: 'kg', speed: 'mph' }) // 'VNE 184.12 mph (160 kt) is above …'
 */
export function restateFigures(sentence: string, units: StatedUnits): string {
  if (isCanonical('weight', units) && isCanonical('speed', units)) return sentence;
  const number = String.raw`-?\d[\d,]*(?:\.\d+)?`;
  const figureOrRange = new RegExp(`(${number})(?: to (${number}))? (kt|kg)\\b`, 'g');
  return sentence.replace(figureOrRange, (whole, first: string, second: string | undefined, unit: 'kt' | 'kg') => {
    const quantity: StatedQuantity = unit === 'kt' ? 'speed' : 'weight';
    if (isCanonical(quantity, units)) return whole;
    const restate = (figure: string) => {
      const stored = Number(figure.replace(/,/g, ''));
      const stated = quantity === 'weight' ? kgToLb(stored) : units.speed === 'mph' ? ktToMph(stored) : ktToKmh(stored);
      return roundTo(stated, 2).toLocaleString('en-GB', { maximumFractionDigits: 2 });
    };
    return `${restate(first)}${second === undefined ? '' : ` to ${restate(second)}`} ${statedSymbol(quantity, units)} (${whole})`;
  });
}

/** A field's words with its "(kt)" and "(kg)" naming the stated units instead: "VNE (kt)" → "VNE (mph)". */
export function statedUnitWords(words: string, units: StatedUnits): string {
  return words.replace(/\(kt\)/g, `(${statedSymbol('speed', units)})`).replace(/\(kg\)/g, `(${statedSymbol('weight', units)})`);
}
