import type { CoverageCell, CoverageOutcome, CoverageRange } from '@shared/card/coverage-report';

/**
 * Words and figures of the coverage picture. Locale-independent on purpose (thousands with a
 * comma, a true minus sign), so the picture reads like the flight manual's pages and the
 * server's sentences beside it.
 */

const MINUS = '\u2212';

export function groupedNumber(value: number): string {
  const whole = Math.round(Math.abs(value))
    .toString()
    .replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return (value < 0 && Math.round(value) !== 0 ? MINUS : '') + whole;
}

export const formatWeightKg = (kg: number): string => `${groupedNumber(kg)} kg`;
export const formatAltitudeFt = (ft: number): string => `${groupedNumber(ft)} ft`;

/** `+15 °C`, `−20 °C`, `0 °C`. */
export function formatOatC(oatC: number): string {
  const rounded = Math.round(oatC);
  return `${rounded > 0 ? '+' : ''}${groupedNumber(rounded)} °C`;
}

export function formatRange(range: CoverageRange, format: (value: number) => string): string {
  return `${format(range[0])} to ${format(range[1])}`;
}

/** `3,400 kg, 4,000 ft, +40 °C`. */
export function pointLabel(cell: Pick<CoverageCell, 'weightKg' | 'pressureAltitudeFt' | 'oatC'>): string {
  return `${formatWeightKg(cell.weightKg)}, ${formatAltitudeFt(cell.pressureAltitudeFt)}, ${formatOatC(cell.oatC)}`;
}

/** The outcome as words, shared by cells, the legend and the counts. */
export const OUTCOME_WORDS: Readonly<Record<CoverageOutcome, string>> = {
  issued: 'card issued',
  refused: 'card refused',
  'rule-broken': 'rule broken',
};

/** The symbol of each outcome; with the cell's fill pattern it carries the meaning without colour. */
export const OUTCOME_SYMBOLS: Readonly<Record<CoverageOutcome, string>> = {
  issued: '✓',
  refused: '✕',
  'rule-broken': '!',
};

export function pointsWord(count: number): string {
  return `${groupedNumber(count)} ${count === 1 ? 'point' : 'points'}`;
}
