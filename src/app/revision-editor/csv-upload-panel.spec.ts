import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import type { SpeedTableUploadResponse } from '@shared/api/uploads';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { CsvUploadPanel } from './csv-upload-panel';

jest.setTimeout(30_000);

/** As the server answers a tabulated-speed CSV with a decimal comma on line 3 and a gap on line 4. */
const withBadRows: SpeedTableUploadResponse = {
  layout: 'tabulated-speed',
  columns: ['speed_code', 'configuration_key', 'weight_kg', 'value_kt'],
  rows: [
    { line: 2, values: { speed_code: 'VR', configuration_key: 'takeoff-flap', weight_kg: '900', value_kt: '52' } },
    { line: 3, values: { speed_code: 'VR', configuration_key: 'takeoff-flap', weight_kg: '1000', value_kt: '54,5' } },
    { line: 4, values: { speed_code: 'VR', configuration_key: 'takeoff-flap', weight_kg: '', value_kt: '57' } },
  ],
  errors: [
    { line: 3, column: 'value_kt', reason: 'Use a point as the decimal separator: 54.5, not 54,5.' },
    { line: 4, column: 'weight_kg', reason: 'Enter a weight in kg; this cell is empty.' },
  ],
  statedUnits: { weight: 'kg', speed: 'kt' },
  speeds: [],
};

describe('CsvUploadPanel', () => {
  let fixture: ComponentFixture<CsvUploadPanel>;
  let backend: HttpTestingController;
  let page: HTMLElement;
  let accepted: SpeedTableUploadResponse[];

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [CsvUploadPanel], providers: [provideHttpClient(), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CsvUploadPanel);
    page = fixture.nativeElement;
    accepted = [];
    fixture.componentInstance.accepted.subscribe((upload) => accepted.push(upload));
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function upload(answer: unknown, status = 200): Promise<void> {
    const picker = page.querySelector<HTMLInputElement>('[data-testid="csv-file"]')!;
    Object.defineProperty(picker, 'files', { value: [new File(['x'], 'vr.csv', { type: 'text/csv' })], configurable: true });
    picker.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    backend.expectOne(REVISION_PATHS.speedTableUpload).flush(answer, { status, statusText: 'x' });
    await fixture.whenStable();
  }

  const acceptButton = () => page.querySelector<HTMLButtonElement>('[data-testid="accept-preview"]')!;

  it('marks the bad rows with their reasons and refuses to accept the preview', async () => {
    await upload(withBadRows);
    expect(page.querySelector('[data-testid="csv-verdict"]')?.textContent).toContain('3 rows read; 2 rows have problems');
    const rows = Array.from(page.querySelectorAll('tbody tr'));
    expect(rows.map((row) => row.classList.contains('bad-row'))).toEqual([false, true, true]);
    expect(rows[1]!.querySelector('[data-testid="row-reason"]')?.textContent).toContain('Speed (kt): Use a point as the decimal separator: 54.5, not 54,5.');
    expect(rows[2]!.querySelector('[data-testid="row-reason"]')?.textContent).toContain('Weight (kg): Enter a weight in kg; this cell is empty.');
    expect(rows[1]!.querySelector('td.bad-cell')?.textContent).toBe('54,5');
    // Units in the headers of the preview.
    expect(Array.from(page.querySelectorAll('thead th')).map((th) => th.textContent?.trim())).toEqual(['Line', 'Speed code', 'Configuration', 'Weight (kg)', 'Speed (kt)', 'Problem']);
    expect(acceptButton().disabled).toBe(true);
    acceptButton().click();
    expect(accepted).toEqual([]);
  });

  it('hands a clean preview to the editor only when accepted', async () => {
    const clean: SpeedTableUploadResponse = {
      ...withBadRows,
      rows: [withBadRows.rows[0]!, { line: 3, values: { ...withBadRows.rows[1]!.values, value_kt: '54.5' } }],
      errors: [],
      speeds: [{ code: 'VR', configurationKey: 'takeoff-flap', table: { byWeightKg: [900, 1000], valuesKt: [52, 54.5] } }],
    };
    await upload(clean);
    expect(page.querySelector('[data-testid="csv-verdict"]')?.textContent).toContain('2 rows read, no problems: 1 tabulated speed.');
    expect(page.querySelectorAll('tr.bad-row')).toHaveLength(0);
    expect(accepted).toEqual([]);
    acceptButton().click();
    await fixture.whenStable();
    expect(accepted).toEqual([clean]);
    expect(page.querySelector('[data-testid="csv-preview"]')).toBeNull();
  });

  it('says why a whole file was refused', async () => {
    await upload({ error: { code: 'unusable_csv', message: 'The header does not match a layout.' } }, 422);
    expect(page.querySelector('[data-testid="csv-problem"]')?.textContent).toContain('The header does not match a layout.');
    expect(page.querySelector('[data-testid="csv-preview"]')).toBeNull();
  });
});
