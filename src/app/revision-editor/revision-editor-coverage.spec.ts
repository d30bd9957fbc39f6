import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { smallCoverageReport } from '@shared/api/testing/coverage-fixtures';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { COVERAGE_PATHS } from '../coverage/coverage-api';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { RevisionEditor } from './revision-editor';
import { DRAFT_ID, setUpRevisionEditor, type RevisionEditorHarness } from './testing/revision-editor-harness';

// Material forms under jsdom on this machine take several seconds per test.
jest.setTimeout(30_000);

type Content = Record<string, unknown>;

describe('RevisionEditor: envelope, speed classes, rule exceptions and the live coverage picture', () => {
  let fixture: ComponentFixture<RevisionEditor>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  let editor: RevisionEditorHarness;

  beforeEach(() => {
    editor = setUpRevisionEditor({ changeSummary: 'Envelope declared.', liveCoverageDebounceMs: 0 });
    ({ fixture, backend, page } = editor);
  });

  afterEach(() => backend.verify());

  const draft = (content: Record<string, unknown>) => editor.draft(content);

  const withEnvelope = (): Content => ({
    ...(demoPistonTrainerContent() as unknown as Content),
    envelope: {
      takeoff: { pressureAltitudeFt: { min: -1000, max: 8000 }, oatC: { min: -30, max: 45 } },
      landing: { pressureAltitudeFt: { min: -1000, max: 8000 }, oatC: { min: -30, max: 45 } },
    },
  });

  /** Content written before books declared an envelope (the demo books now declare one). */
  const withoutEnvelope = (): Content => {
    const { envelope: _declared, ...content } = demoPistonTrainerContent() as unknown as Content;
    return content;
  };

  /** Lets the (zero) debounce run, then answers the last sweep asked for; earlier ones were cancelled. */
  async function sweep(): Promise<TestRequest> {
    await new Promise((done) => setTimeout(done, 5));
    await fixture.whenStable();
    const requests = backend.match(COVERAGE_PATHS.ofContent).filter((r) => !r.cancelled);
    expect(requests).toHaveLength(1);
    return requests[0]!;
  }

  async function answer(request: TestRequest, body: unknown, init?: { status: number; statusText: string }): Promise<void> {
    request.flush(body, init);
    await fixture.whenStable();
  }

  async function openDraft(content: Content): Promise<void> {
    await editor.openDraft(content, fixture);
  }

  const field = (path: string) => page.querySelector<HTMLInputElement>(`[data-path="${path}"]`)!;
  /** The words of an element as read aloud: icons (ligature names) left out. */
  const text = (selector: string) => {
    const element = page.querySelector(selector)?.cloneNode(true) as HTMLElement | undefined;
    element?.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return (element?.textContent ?? '').replace(/\s+/g, ' ').trim();
  };
  const button = (words: string) => Array.from(page.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes(words))!;

  async function type(path: string, value: string): Promise<void> {
    const input = field(path);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  async function choose(path: string, optionText: string): Promise<void> {
    field(path).click();
    await fixture.whenStable();
    const option = Array.from(document.querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.includes(optionText));
    if (!option) throw new Error(`no option ${optionText}`);
    option.click();
    await fixture.whenStable();
  }

  async function save(): Promise<Content> {
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    const patch = backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) });
    const content = (patch.request.body as { content: Content }).content;
    patch.flush({ revision: draft(content) });
    await fixture.whenStable();
    return content;
  }

  it('reads and writes the envelope, the speed class and the reference-stall flag', async () => {
    await openDraft(withEnvelope());
    await answer(await sweep(), { report: smallCoverageReport() });
    expect(field('envelope.takeoff.pressureAltitudeFt.min').value).toBe('-1000');
    expect(field('envelope.landing.oatC.max').value).toBe('45');

    await type('envelope.takeoff.pressureAltitudeFt.max', '10000');
    await choose('speeds.0.speedClass', 'Stall speed (rounded up)');
    page.querySelector<HTMLInputElement>('[data-path="statesReferenceStallSpeeds"] input')!.click();
    await fixture.whenStable();
    backend.match(COVERAGE_PATHS.ofContent);

    const content = await save();
    expect(content['envelope']).toEqual({
      takeoff: { pressureAltitudeFt: { min: -1000, max: 10000 }, oatC: { min: -30, max: 45 } },
      landing: { pressureAltitudeFt: { min: -1000, max: 8000 }, oatC: { min: -30, max: 45 } },
    });
    expect((content['speeds'] as Content[])[0]).toMatchObject({ code: (demoPistonTrainerContent().speeds[0] as { code: string }).code, speedClass: 'stall' });
    expect((content['speeds'] as Content[])[1]).not.toHaveProperty('speedClass');
    expect(content['statesReferenceStallSpeeds']).toBe(true);
    expect(content).not.toHaveProperty('ruleExceptions');
    backend.match(COVERAGE_PATHS.ofContent);
  });

  it('leaves the envelope out of content that never had one, and names a missing bound', async () => {
    await openDraft(withoutEnvelope());
    await answer(await sweep(), { report: smallCoverageReport() });
    await type('envelope.landing.oatC.min', '-20');
    // Half an envelope does not parse: the picture waits, no sweep is asked for.
    await new Promise((done) => setTimeout(done, 5));
    backend.expectNone(COVERAGE_PATHS.ofContent);
    expect(text('[data-testid="problem-summary"]')).toContain('Envelope › takeoff › lowest pressure altitude (ft): Give the lowest pressure altitude.');
    expect(text('[data-testid="coverage-state"]')).toContain('The content does not parse yet, so its coverage cannot be checked');
    expect(text('[data-testid="coverage-stale"]')).toBe('The picture below is from the last check, before your latest changes.');

    await type('envelope.landing.oatC.min', '');
    const content = await save();
    expect(content).not.toHaveProperty('envelope');
    backend.match(COVERAGE_PATHS.ofContent);
  });

  it('draws the live picture for the content being edited, and says when the server cannot be reached', async () => {
    await openDraft(withEnvelope());
    const first = await sweep();
    expect((first.request.body as { content: Content }).content['envelope']).toEqual(withEnvelope()['envelope']);
    expect(text('[data-testid="coverage-state"]')).toContain('Sweeping the envelope on the server');
    await answer(first, { report: smallCoverageReport() });
    expect(text('[data-testid="coverage-state"]')).toBe(
      "Checked on the server for the content as it stands now.Submitting will be refused until every point gives a card and every broken rule has the flight manual's reason recorded below.",
    );
    expect(page.querySelectorAll('sw-coverage-picture [data-testid="coverage-sheet"]')).toHaveLength(2);
    expect(text('sw-coverage-picture [data-testid="coverage-verdict"]')).toContain('1 is refused');

    await type('weights.maximumTakeoffKg', '1150');
    await answer(await sweep(), null, { status: 0, statusText: 'Unknown Error' });
    expect(text('[data-testid="coverage-state"]')).toContain('The server cannot be reached, so the coverage cannot be checked now.');
    expect(text('[data-testid="coverage-stale"]')).toContain('from the last check, before your latest changes');
    // The last picture stays for reference.
    expect(page.querySelectorAll('sw-coverage-picture [data-testid="coverage-sheet"]')).toHaveLength(2);

    await type('weights.maximumTakeoffKg', '1100');
    await answer(await sweep(), { error: { code: 'content_invalid', message: 'Check the content.', fields: { 'content.envelope.takeoff': 'The takeoff envelope is above the ceiling.' } } }, { status: 422, statusText: 'Unprocessable Content' });
    expect(text('[data-testid="coverage-state"]')).toContain('The server could not check this content: Check the content. (envelope.takeoff: The takeoff envelope is above the ceiling.)');
  });

  it('records an exception for a broken rule chosen from the current report, with the flight manual’s reason', async () => {
    await openDraft(withEnvelope());
    expect(button('Record an exception')).toBeUndefined();
    await answer(await sweep(), { report: smallCoverageReport() });

    button('Record an exception').click();
    await fixture.whenStable();
    backend.match(COVERAGE_PATHS.ofContent);
    // The one rule the report finds broken (vref-vmc carries an exception but is broken nowhere).
    field('ruleExceptions.0.ruleId').click();
    await fixture.whenStable();
    expect(Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent!.trim())).toEqual(['V1 ≤ VR ≤ V2 (broken at 1 point)']);
    (document.querySelector('mat-option') as HTMLElement).click();
    await fixture.whenStable();
    // Only one rule is broken, so there is nothing more to record.
    expect(button('Record an exception')).toBeUndefined();

    await type('ruleExceptions.0.reason', 'AFM 2.4: V2 is scheduled from the climb gradient.');
    backend.match(COVERAGE_PATHS.ofContent);
    const content = await save();
    expect(content['ruleExceptions']).toEqual([{ ruleId: 'v1-vr-v2', reason: 'AFM 2.4: V2 is scheduled from the climb gradient.' }]);
    backend.match(COVERAGE_PATHS.ofContent);
  });

  it('shows the picture and the sentence when submit answers 422 coverage_failed, and keeps the draft as it is', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await openDraft(withEnvelope());
    await answer(await sweep(), { report: { ...smallCoverageReport(), sheets: [], rules: [], counts: { points: 0, issued: 0, refused: 0, ruleBroken: 0 }, passes: true } });
    expect(text('[data-testid="coverage-state"]')).toBe('Checked on the server for the content as it stands now.');
    expect(page.querySelector('[data-testid="coverage-blocks-submit"]')).toBeNull();
    await type('changeSummary' as string, 'Envelope declared.');
    button('Submit for review').click();
    await fixture.whenStable();
    const patch = backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) });
    patch.flush({ revision: draft((patch.request.body as { content: Content }).content) });
    await fixture.whenStable();
    backend
      .expectOne({ method: 'POST', url: REVISION_PATHS.step(DRAFT_ID, 'submit') })
      .flush(
        { error: { code: 'coverage_failed', message: 'The book gives no card at 1 point of its envelope and breaks 1 rule without a recorded exception.', report: smallCoverageReport() } },
        { status: 422, statusText: 'Unprocessable Content' },
      );
    await fixture.whenStable();
    backend.match(COVERAGE_PATHS.ofContent);

    expect(text('[data-testid="editor-status"]')).toContain('The book gives no card at 1 point of its envelope and breaks 1 rule without a recorded exception.');
    expect(text('[data-testid="coverage-submit-refusal"]')).toBe(
      'Submitting was refused: The book gives no card at 1 point of its envelope and breaks 1 rule without a recorded exception. Your draft is saved as it was.',
    );
    const picture = page.querySelector('[data-testid="live-coverage"] sw-coverage-picture')!;
    expect(picture.querySelector('button.cell[data-outcome="refused"]')?.getAttribute('aria-label')).toBe('3,400 kg, 4,000 ft, +40 °C: card refused');
    expect(picture.querySelector('[data-rule="v1-vr-v2"] [data-testid="rule-no-exception"]')).not.toBeNull();
    // Nothing else lost: the fields hold what was typed, and the engineer stays on the page.
    expect(field('envelope.takeoff.pressureAltitudeFt.max').value).toBe('8000');
    expect(field('changeSummary').value).toBe('Envelope declared.');
    expect(navigate).not.toHaveBeenCalled();
  });
});
