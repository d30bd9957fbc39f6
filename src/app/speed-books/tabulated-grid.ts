import type { TabulatedSpeed } from '@shared/speed-book/revision-content';

/** One table of a tabulated speed as it is printed: weights down, pressure altitudes across. */
export interface GridPage {
  /** The OAT this page holds, or null when the speed does not vary with temperature. */
  readonly oatC: number | null;
  /** Column headings: pressure altitudes in ft, or null for the single speed column. */
  readonly altitudesFt: readonly (number | null)[];
  readonly rows: readonly { readonly weightKg: number; readonly valuesKt: readonly (number | null)[] }[];
}

type Nested = number | Nested[] | unknown;

function at(values: Nested, ...indexes: number[]): number | null {
  let value: unknown = values;
  for (const index of indexes) {
    if (!Array.isArray(value)) return null;
    value = value[index];
  }
  return typeof value === 'number' ? value : null;
}

/** The speed's table as pages of weight × altitude, one page per OAT (`valuesKt[w][p][t]`). */
export function gridPages(speed: Pick<TabulatedSpeed, 'byWeightKg' | 'byPressureAltitudeFt' | 'byOatC' | 'valuesKt'>): GridPage[] {
  const altitudes = speed.byPressureAltitudeFt;
  const oats = speed.byOatC;
  const pageOats: (number | null)[] = oats ?? [null];
  const columns: (number | null)[] = altitudes ?? [null];
  return pageOats.map((oatC, t) => ({
    oatC,
    altitudesFt: columns,
    rows: speed.byWeightKg.map((weightKg, w) => ({
      weightKg,
      valuesKt: columns.map((_, p) => {
        const indexes = [w];
        if (altitudes) indexes.push(p);
        if (oats) indexes.push(t);
        return at(speed.valuesKt, ...indexes);
      }),
    })),
  }));
}
