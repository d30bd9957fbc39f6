import { HttpTestingController } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { revisionSummary, speedBook } from '../speed-books/testing/revision-fixtures';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { RevisionEditor } from './revision-editor';
import { DRAFT_ID, setUpRevisionEditor, type RevisionEditorHarness } from './testing/revision-editor-harness';

// Material forms under jsdom on this machine take several seconds per test.
jest.setTimeout(30_000);

describe('RevisionEditor', () => {
  let fixture: ComponentFixture<RevisionEditor>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  let editor: RevisionEditorHarness;

  beforeEach(() => {
    editor = setUpRevisionEditor({
      changeSummary: 'Flaps-up table from the calibration flight.',
      // The live coverage sweep has its own tests (revision-editor-coverage.spec.ts); here it never fires.
      liveCoverageDebounceMs: 3_600_000,
    });
    ({ fixture, backend, page } = editor);
  });

  afterEach(() => backend.verify());

  const draft = (content: Record<string, unknown>) => editor.draft(content);

  async function openDraft(content: Record<string, unknown>): Promise<void> {
    await editor.openDraft(content, fixture);
  }

  const field = (path: string) => page.querySelector<HTMLInputElement>(`[data-path="${path}"]`)!;
  const formField = (path: string) => field(path).closest('mat-form-field')!;

  const submitButton = () => Array.from(page.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Submit for review'))!;

  async function type(path: string, value: string): Promise<void> {
    const input = field(path);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  it('shows the shared schema’s sentences at the fields they are about', async () => {
    const content = demoPistonTrainerContent();
    content.configurations[0]!.positionError[2]!.iasKt = 55;
    await openDraft(content as unknown as Record<string, unknown>);

    // Listed at the top before anything is touched, and marked at its cell.
    const summary = () => page.querySelector('[data-testid="problem-summary"]')!.textContent!;
    expect(summary()).toContain('1 thing to fix before submitting');
    expect(summary()).toContain('Flaps up › position-error row 3 › IAS (kt): The IAS column must increase strictly: 55 kt does not exceed 60 kt above it.');
    const cell = field('configurations.0.positionError.2.iasKt').closest('td')!;
    expect(cell.classList).toContain('bad');
    expect(field('configurations.0.positionError.2.iasKt').getAttribute('aria-invalid')).toBe('true');
    expect(page.querySelector('[data-testid="position-error-problems"]')?.textContent).toContain('Row 3: The IAS column must increase strictly');
    expect(submitButton().disabled).toBe(true);

    // A fixed mistake goes; a new one appears at the field where it is made.
    await type('configurations.0.positionError.2.iasKt', '80');
    expect(cell.classList).not.toContain('bad');
    await type('weights.maximumLandingKg', '1200');
    expect(formField('weights.maximumLandingKg').querySelector('mat-error')?.textContent?.trim()).toBe('The maximum landing weight cannot exceed the maximum takeoff weight.');
    await type('weights.maximumLandingKg', '1100');
    expect(formField('weights.maximumLandingKg').querySelector('mat-error')).toBeNull();
    await type('weights.minimumKg', '');
    expect(formField('weights.minimumKg').querySelector('mat-error')?.textContent?.trim()).toBe('Give the minimum weight.');
    expect(summary()).toContain('Weights › minimum weight (kg): Give the minimum weight.');
    await type('weights.minimumKg', '700');
    expect(formField('weights.minimumKg').querySelector('mat-error')).toBeNull();
    expect(summary()).toContain('The content is complete and consistent.');
    expect(submitButton().disabled).toBe(false);
  });

  it('accepts a CSV preview into the draft and saves it with PATCH', async () => {
    await openDraft(demoPistonTrainerContent() as unknown as Record<string, unknown>);
    const picker = page.querySelector<HTMLInputElement>('[data-testid="csv-file"]')!;
    const file = new File(['configuration_key,ias_kt,cas_kt\nclean,35,44\nclean,160,156\n'], 'clean.csv', { type: 'text/csv' });
    Object.defineProperty(picker, 'files', { value: [file] });
    picker.dispatchEvent(new Event('change'));
    await fixture.whenStable();

    const upload = backend.expectOne(REVISION_PATHS.speedTableUpload);
    expect(upload.request.method).toBe('POST');
    expect((upload.request.body as FormData).get('file')).toBeInstanceOf(File);
    upload.flush({
      layout: 'position-error',
      columns: ['configuration_key', 'ias_kt', 'cas_kt'],
      rows: [
        { line: 2, values: { configuration_key: 'clean', ias_kt: '35', cas_kt: '44' } },
        { line: 3, values: { configuration_key: 'clean', ias_kt: '160', cas_kt: '156' } },
      ],
      errors: [],
      statedUnits: { speed: 'kt' },
      configurations: [{ key: 'clean', positionError: [{ iasKt: 35, casKt: 44 }, { iasKt: 160, casKt: 156 }] }],
    });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="csv-verdict"]')?.textContent).toContain('2 rows read, no problems');
    // Nothing is sent before the engineer accepts.
    backend.expectNone({ method: 'PATCH' });

    page.querySelector<HTMLButtonElement>('[data-testid="accept-preview"]')!.click();
    await fixture.whenStable();
    const patch = backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) });
    const body = patch.request.body as { content: ReturnType<typeof demoPistonTrainerContent>; changeSummary: string };
    expect(body.changeSummary).toBe('Flaps-up table from the calibration flight.');
    expect(body.content.configurations[0]).toEqual({ key: 'clean', label: 'Flaps up', positionError: [{ iasKt: 35, casKt: 44 }, { iasKt: 160, casKt: 156 }] });
    // The rest of the content goes back as it came.
    expect(body.content.configurations.slice(1)).toEqual(demoPistonTrainerContent().configurations.slice(1));
    expect(body.content.limits).toEqual(demoPistonTrainerContent().limits);
    expect(body.content.speeds).toEqual(demoPistonTrainerContent().speeds);
    patch.flush({ revision: draft(body.content as unknown as Record<string, unknown>) });
    await fixture.whenStable();

    expect(page.querySelector('[data-testid="upload-changes"]')?.textContent).toContain('Position-error table of clean: 2 points.');
    expect(page.querySelector('[data-testid="editor-status"]')?.textContent).toContain('Draft saved.');
    expect(page.querySelector('[data-testid="csv-preview"]')).toBeNull();
  });

  it('puts the server’s 422 field sentences at their fields when submitting is refused', async () => {
    await openDraft(demoPistonTrainerContent() as unknown as Record<string, unknown>);
    const submit = submitButton();
    expect(submit.disabled).toBe(false);
    submit.click();
    await fixture.whenStable();
    backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) }).flush({ revision: draft(demoPistonTrainerContent() as unknown as Record<string, unknown>) });
    await fixture.whenStable();
    backend.expectOne({ method: 'POST', url: REVISION_PATHS.step(DRAFT_ID, 'submit') }).flush(
      {
        error: {
          code: 'content_invalid',
          message: 'The revision cannot be submitted until these fields are right.',
          fields: { 'content.aircraft.engines': 'This speed book’s type ZZP1 has 2 engine(s).' },
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="editor-status"]')?.textContent).toContain('The revision cannot be submitted until these fields are right.');
    expect(formField('aircraft.engines').querySelector('mat-error')?.textContent?.trim()).toBe('This speed book’s type ZZP1 has 2 engine(s).');
  });

  it('edits a tabulated speed’s grid and sends it nested weight by altitude', async () => {
    const content = demoPistonTrainerContent();
    content.speeds = [
      {
        code: 'VR',
        label: 'Rotate',
        phase: 'takeoff',
        configurationKey: 'takeoff-flap',
        basis: 'ias',
        kind: 'tabulated',
        byWeightKg: [800, 1100],
        byPressureAltitudeFt: [0, 4000],
        valuesKt: [
          [50, 52],
          [55, 57],
        ],
      },
    ];
    await openDraft(content as unknown as Record<string, unknown>);
    expect(field('speeds.0.valuesKt.1.1').value).toBe('57');
    await type('speeds.0.valuesKt.1.1', '58');
    await type('speeds.0.byWeightKg.0', '650');
    expect(page.querySelector('[data-testid="grid-problems"]')?.textContent).toContain('Weight 1: 650 kg is outside the weight range (700 to 1,100 kg).');

    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    const patch = backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) });
    const speed = (patch.request.body as { content: { speeds: Record<string, unknown>[] } }).content.speeds[0];
    expect(speed).toMatchObject({ kind: 'tabulated', byWeightKg: [650, 1100], byPressureAltitudeFt: [0, 4000], valuesKt: [[50, 52], [55, 58]] });
    expect(speed).not.toHaveProperty('byOatC');
    patch.flush({ revision: draft(content as unknown as Record<string, unknown>) });
    await fixture.whenStable();
  });

  it('says what is missing when a position-error table is emptied row by row', async () => {
    await openDraft(demoPistonTrainerContent() as unknown as Record<string, unknown>);
    const removeButtons = () => Array.from(page.querySelectorAll<HTMLButtonElement>('[data-testid="configuration-editor"]:nth-of-type(1) button[aria-label^="Remove row"]'));
    while (removeButtons().length) {
      removeButtons()[0]!.click();
      await fixture.whenStable();
    }
    expect(page.querySelector('[data-testid="position-error-problems"]')?.textContent).toContain('A position-error table needs at least two IAS/CAS points.');
    expect(submitButton().disabled).toBe(true);
  });

  // A closing dialog reports after its (disabled) exit animation: a macrotask later.
  const settle = async () => {
    await new Promise((done) => setTimeout(done, 50));
    await fixture.whenStable();
  };

  it('discards the draft only once the engineer confirms, then goes back to the drafts', async () => {
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigate').mockResolvedValue(true);
    await openDraft(demoPistonTrainerContent() as unknown as Record<string, unknown>);
    const discard = () => page.querySelector<HTMLButtonElement>('[data-testid="discard-draft"]')!;
    const dialogButton = (text: string) => Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')).find((b) => b.textContent?.includes(text))!;

    discard().click();
    await fixture.whenStable();
    expect(document.querySelector('[data-testid="discard-draft-sentence"]')?.textContent).toContain('Draft 3 of');
    dialogButton('Keep the draft').click();
    await settle();
    backend.expectNone(REVISION_PATHS.revision(DRAFT_ID));

    discard().click();
    await fixture.whenStable();
    dialogButton('Discard draft').click();
    await settle();
    const request = backend.expectOne(REVISION_PATHS.revision(DRAFT_ID));
    expect(request.request.method).toBe('DELETE');
    request.flush('', { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/drafts']);
  });

  it('refuses to edit a revision that is no longer a draft', async () => {
    fixture.componentRef.setInput('revisionId', DRAFT_ID);
    await fixture.whenStable();
    backend.expectOne(REVISION_PATHS.revision(DRAFT_ID)).flush({ revision: { ...draft(demoPistonTrainerContent() as unknown as Record<string, unknown>), status: 'in_review' } });
    backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook([revisionSummary()]) });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="not-a-draft"]')?.textContent).toContain('Revision 3 is no longer a draft');
    expect(page.querySelector('form')).toBeNull();
  });
});
