import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CoverageCell, CoverageOutcome, CoverageReport, CoverageSheet } from '@shared/card/coverage-report';
import { OUTCOME_SYMBOLS, OUTCOME_WORDS, formatAltitudeFt, formatOatC, formatRange, formatWeightKg, groupedNumber, pointLabel, pointsWord } from './coverage-format';

interface CellView {
  readonly key: string;
  readonly cell: CoverageCell;
  readonly symbol: string;
  readonly label: string;
}

interface BandView {
  readonly key: string;
  readonly oatC: number;
  readonly caption: string;
  readonly problems: number;
  /** Highest altitude first, as a chart's altitude axis rises. */
  readonly rows: readonly { readonly altitudeFt: number; readonly cells: readonly CellView[] }[];
}

interface SheetView {
  readonly key: string;
  readonly title: string;
  readonly envelope: string;
  readonly counts: Readonly<Record<CoverageOutcome, number>> & { readonly points: number };
  readonly weightsKg: readonly number[];
  readonly bands: readonly BandView[];
}

const PHASE_WORDS = { takeoff: 'Takeoff', landing: 'Landing' } as const;

/**
 * The envelope proof of a speed book drawn so an approver reads it at a glance: per sheet (phase ×
 * configuration) one weight × pressure-altitude grid per temperature band, each cell marked by
 * symbol and pattern as issued, refused or rule broken; hovering, tapping or focusing a cell
 * gives its reason below the grids. The broken rules follow with their source and the
 * engineer's recorded exception. Each grid is one tab stop; arrow keys move within it.
 */
@Component({
  selector: 'sw-coverage-picture',
  imports: [MatIconModule],
  templateUrl: './coverage-picture.html',
  styleUrl: './coverage-picture.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'sw-coverage-picture' },
})
export class CoveragePicture {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  readonly report = input.required<CoverageReport>();

  protected readonly outcomes = (['issued', 'refused', 'rule-broken'] as const).map((outcome) => ({
    outcome,
    symbol: OUTCOME_SYMBOLS[outcome],
    words: OUTCOME_WORDS[outcome],
  }));
  protected readonly formatWeightKg = formatWeightKg;
  protected readonly formatAltitudeFt = formatAltitudeFt;
  protected readonly groupedNumber = groupedNumber;
  protected readonly pointsWord = pointsWord;

  protected readonly sheets = computed(() => this.report().sheets.map((sheet, s) => sheetView(sheet, s, this.report())));
  protected readonly counts = computed(() => this.report().counts);
  protected readonly blockingRules = computed(() => this.report().rules.filter((r) => r.brokenAt > 0 && r.exception === undefined));

  /** Per sheet, the cell last tapped or focused: its reason stays shown. */
  private readonly pinned = signal<Readonly<Record<string, CellView>>>({});
  /** Per sheet, the cell under the pointer: shown while it is there, then the pinned one again. */
  private readonly hovered = signal<Readonly<Record<string, CellView | undefined>>>({});
  /** Per grid, the cell that takes the focus when the grid is tabbed into. */
  private readonly active = signal<Readonly<Record<string, string>>>({});

  protected selectedIn(sheet: SheetView): CellView | undefined {
    return this.hovered()[sheet.key] ?? this.pinned()[sheet.key];
  }

  protected isPinned(sheet: SheetView, cell: CellView): boolean {
    return this.pinned()[sheet.key] === cell;
  }

  protected hoverCell(sheet: SheetView, cell: CellView | undefined): void {
    this.hovered.update((all) => ({ ...all, [sheet.key]: cell }));
  }

  protected isActive(band: BandView, cell: CellView): boolean {
    const active = this.active()[band.key];
    return active === undefined ? cell === band.rows[0]?.cells[0] : active === cell.key;
  }

  protected showCell(sheet: SheetView, band: BandView, cell: CellView): void {
    this.pinned.update((all) => ({ ...all, [sheet.key]: cell }));
    this.hovered.update((all) => ({ ...all, [sheet.key]: undefined }));
    this.active.update((all) => ({ ...all, [band.key]: cell.key }));
  }

  protected ruleTitles(cell: CoverageCell): string {
    const rules = this.report().rules;
    return (cell.ruleIds ?? []).map((id) => rules.find((r) => r.ruleId === id)?.title ?? id).join('; ');
  }

  protected exceptionFor(cell: CoverageCell): string | undefined {
    const rules = this.report().rules;
    const excepted = (cell.ruleIds ?? []).map((id) => rules.find((r) => r.ruleId === id)).filter((r) => r?.exception !== undefined);
    return excepted.length ? excepted.map((r) => `${r!.title}: ${r!.exception}`).join(' ') : undefined;
  }

  /** Arrow keys, Home and End move the focus within one band's grid (a roving tab stop). */
  protected moveFocus(event: KeyboardEvent, sheet: SheetView, band: BandView, row: number, column: number): void {
    const steps: Record<string, [number, number]> = { ArrowUp: [-1, 0], ArrowDown: [1, 0], ArrowLeft: [0, -1], ArrowRight: [0, 1] };
    const lastRow = band.rows.length - 1;
    const lastColumn = (band.rows[0]?.cells.length ?? 1) - 1;
    let target: [number, number] | null = null;
    if (event.key in steps) {
      const [dr, dc] = steps[event.key]!;
      target = [Math.min(lastRow, Math.max(0, row + dr)), Math.min(lastColumn, Math.max(0, column + dc))];
    } else if (event.key === 'Home') target = [row, 0];
    else if (event.key === 'End') target = [row, lastColumn];
    if (!target) return;
    event.preventDefault();
    const cell = band.rows[target[0]]?.cells[target[1]];
    if (!cell) return;
    this.showCell(sheet, band, cell);
    this.host.nativeElement.querySelector<HTMLElement>(`[data-cell="${cell.key}"]`)?.focus();
  }
}

function sheetView(sheet: CoverageSheet, s: number, report: CoverageReport): SheetView {
  const { weightsKg, pressureAltitudesFt, oatsC } = sheet.grid;
  const key = `s${s}`;
  const counts = { issued: 0, refused: 0, 'rule-broken': 0, points: sheet.cells.length };
  for (const cell of sheet.cells) counts[cell.outcome] += 1;
  const bands = oatsC.map((oatC, o): BandView => {
    const rows = pressureAltitudesFt
      .map((altitudeFt, a) => ({
        altitudeFt,
        cells: weightsKg.map((_, w): CellView => {
          const cell = sheet.cells[(o * pressureAltitudesFt.length + a) * weightsKg.length + w]!;
          return {
            key: `${key}-${o}-${a}-${w}`,
            cell,
            symbol: OUTCOME_SYMBOLS[cell.outcome],
            label: `${pointLabel(cell)}: ${OUTCOME_WORDS[cell.outcome]}`,
          };
        }),
      }))
      .reverse();
    const problems = rows.reduce((sum, row) => sum + row.cells.filter((c) => c.cell.outcome !== 'issued').length, 0);
    return { key: `${key}-${o}`, oatC, caption: `OAT ${formatOatC(oatC)}`, problems, rows };
  });
  const envelope = report.envelope[sheet.phase];
  return {
    key,
    title: `${PHASE_WORDS[sheet.phase]} · ${sheet.configurationLabel}`,
    envelope: `${formatRange(envelope.weightKg, formatWeightKg)}; ${formatRange(envelope.pressureAltitudeFt, formatAltitudeFt)}; ${formatRange(envelope.oatC, formatOatC)}`,
    counts,
    weightsKg,
    bands,
  };
}
