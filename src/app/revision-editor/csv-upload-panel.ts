import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { CsvRowError, SpeedTableUploadResponse } from '@shared/api/uploads';
import { UNIT_SYMBOLS } from '@shared/speed-book/stated-units';
import { ApiRequestError } from '../core/api/api-request-error';
import { RevisionsApi } from '../speed-books/revisions-api';

/** Units of the CSV layouts' columns, for the preview's headers. */
const COLUMN_HEADINGS: Readonly<Record<string, string>> = {
  configuration_key: 'Configuration',
  ias_kt: 'IAS (kt)',
  cas_kt: 'CAS (kt)',
  speed_code: 'Speed code',
  weight_kg: 'Weight (kg)',
  pressure_altitude_ft: 'Pressure altitude (ft)',
  oat_c: 'OAT (°C)',
  value_kt: 'Speed (kt)',
};

const UNIT_COLUMN_WORDS: Readonly<Record<string, string>> = { ias: 'IAS', cas: 'CAS', value: 'Speed', weight: 'Weight' };

/** A column's heading: ours by name, a unit-bearing one (`ias_mph`, `weight_lb`) with its unit. */
function columnHeading(column: string): string {
  const known = COLUMN_HEADINGS[column];
  if (known) return known;
  const match = /^(ias|cas|value|weight)_(kg|lb|kt|mph|kmh)$/.exec(column);
  return match ? `${UNIT_COLUMN_WORDS[match[1]!]} (${UNIT_SYMBOLS[match[2] as keyof typeof UNIT_SYMBOLS]})` : column;
}

/**
 * CSV upload into a table of the draft: the server parses the file, this shows every row with
 * the bad ones marked and their reasons, and only an accepted preview reaches the draft.
 */
@Component({
  selector: 'sw-csv-upload-panel',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './csv-upload-panel.html',
  styleUrl: './csv-upload-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CsvUploadPanel {
  private readonly api = inject(RevisionsApi);
  private readonly destroyRef = inject(DestroyRef);

  /** True while the editor saves an accepted preview. */
  readonly busy = input(false);
  readonly accepted = output<SpeedTableUploadResponse>();

  protected readonly uploading = signal(false);
  protected readonly fileName = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly preview = signal<SpeedTableUploadResponse | null>(null);

  protected readonly headings = computed(() => (this.preview()?.columns ?? []).map((column) => ({ column, heading: columnHeading(column) })));
  /** The units the file's header states, in words, for the preview. */
  protected readonly unitsSentence = computed(() => {
    const units = this.preview()?.statedUnits;
    if (!units) return '';
    const parts = [units.speed ? `speeds in ${UNIT_SYMBOLS[units.speed]}` : '', units.weight ? `weights in ${UNIT_SYMBOLS[units.weight]}` : ''].filter(Boolean);
    return parts.length ? `The file gives ${parts.join(' and ')}; the figures below are as written, the draft stores kt and kg.` : '';
  });
  protected readonly errorsByLine = computed(() => {
    const byLine = new Map<number, CsvRowError[]>();
    for (const error of this.preview()?.errors ?? []) byLine.set(error.line, [...(byLine.get(error.line) ?? []), error]);
    return byLine;
  });
  protected readonly badRowCount = computed(() => (this.preview()?.rows ?? []).filter((row) => this.errorsByLine().has(row.line)).length);
  protected readonly tableCount = computed(() => {
    const preview = this.preview();
    if (!preview) return 0;
    return preview.layout === 'position-error' ? preview.configurations.length : preview.speeds.length;
  });
  protected readonly acceptable = computed(() => {
    const preview = this.preview();
    return preview !== null && preview.errors.length === 0 && this.tableCount() > 0;
  });

  protected uploadFile(event: Event): void {
    const field = event.target as HTMLInputElement;
    const file = field.files?.[0];
    field.value = ''; // the same file, corrected, can be chosen again
    if (!file) return;
    this.fileName.set(file.name);
    this.problem.set(null);
    this.preview.set(null);
    this.uploading.set(true);
    this.api
      .uploadSpeedTable(file)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (preview) => {
          this.preview.set(preview);
          this.uploading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.uploading.set(false);
        },
      });
  }

  protected acceptPreview(): void {
    const preview = this.preview();
    if (!preview || !this.acceptable()) return;
    this.accepted.emit(preview);
    this.discardPreview();
  }

  protected discardPreview(): void {
    this.preview.set(null);
    this.fileName.set(null);
  }

  protected columnReasons(line: number): string[] {
    return (this.errorsByLine().get(line) ?? []).map((error) => (error.column ? `${columnHeading(error.column)}: ${error.reason}` : error.reason));
  }

  protected cellBad(line: number, column: string): boolean {
    return (this.errorsByLine().get(line) ?? []).some((error) => error.column === column);
  }
}
