import { CANONICAL_UNITS, UNIT_SYMBOLS, describeFigures, quantityAtPath, statedUnitWords, type StatedUnits } from '@shared/speed-book/stated-units';
import { FIELD_WORDS } from '../revision-editor/problem-location';

/**
 * A diff path in words: `configurations[landing-flap].positionError.1.casKt` →
 * "Configuration landing-flap › position-error row 2 › CAS (kt)".
 */
export function changeLocation(path: string, units: StatedUnits = CANONICAL_UNITS): string {
  const parts: string[] = [];
  const tokens = path.match(/[^.[\]]+|\[[^\]]*\]/g) ?? [path];
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!;
    const next = tokens[i + 1];
    if (token === 'configurations' && next?.startsWith('[')) {
      parts.push(`Configuration ${next.slice(1, -1)}`);
      i++;
    } else if (token === 'speeds' && next?.startsWith('[')) {
      const [code, configuration] = next.slice(1, -1).split('@');
      parts.push(`Speed ${code} (${configuration})`);
      i++;
    } else if (token === 'positionError' && next !== undefined && /^\d+$/.test(next)) {
      parts.push(`position-error row ${Number(next) + 1}`);
      i++;
    } else if (token === 'vfeKt' && next !== undefined) {
      parts.push(`VFE ${next} (kt)`);
      i++;
    } else if (/^\d+$/.test(token)) {
      parts.push(`entry ${Number(token) + 1}`);
    } else if (i === 0 && ['aircraft', 'weights', 'limits'].includes(token)) {
      parts.push(token[0]!.toUpperCase() + token.slice(1));
    } else {
      parts.push(FIELD_WORDS[token] ?? token);
    }
  }
  // Field words name kt and kg; the diff shows figures in the flight manual's units first.
  return statedUnitWords(parts.join(' › '), units);
}

/**
 * A changed value in the revision's stated units: weights and speeds as "161 mph (139.9 kt)",
 * the stated units themselves as "lb, mph"; anything else as `changeValue` gives it.
 */
export function changeValueIn(path: string, value: unknown, units: StatedUnits): string {
  if (path === 'statedUnits' || path.startsWith('statedUnits.')) return statedUnitsValue(value);
  return changeValue(describeFigures(value, quantityAtPath(path), units));
}

function statedUnitsValue(value: unknown): string {
  if (value === undefined) return 'kg, kt (none named)';
  const symbol = (unit: unknown) => UNIT_SYMBOLS[unit as keyof typeof UNIT_SYMBOLS] ?? String(unit);
  if (typeof value === 'object' && value !== null) {
    const units = value as Record<string, unknown>;
    return `${symbol(units['weight'])}, ${symbol(units['speed'])}`;
  }
  return symbol(value);
}

/** A changed value as one short line: numbers and words as they are, records as key: value. */
export function changeValue(value: unknown): string {
  if (value === undefined) return '—';
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (typeof value === 'string') return value === '' ? '(empty)' : value;
  return JSON.stringify(value, null, 1).replace(/\s*\n\s*/g, ' ');
}
