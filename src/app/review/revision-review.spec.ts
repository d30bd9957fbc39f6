import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SessionUser } from '@shared/api/auth';
import { smallCoverageReport } from '@shared/api/testing/coverage-fixtures';
import { demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { COVERAGE_PATHS } from '../coverage/coverage-api';
import { AuthService } from '../core/auth/auth-service';
import { PEOPLE, revisionSummary, revisionView, sessionUser, speedBook } from '../speed-books/testing/revision-fixtures';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { RevisionReview } from './revision-review';

jest.setTimeout(30_000);

const IN_REVIEW = 12;
const PUBLISHED = 8;
const inReview = (content: Record<string, unknown> = demoPistonTrainerContentRevised() as unknown as Record<string, unknown>) =>
  revisionView(content, {
    id: IN_REVIEW,
    number: 3,
    status: 'in_review',
    authorId: PEOPLE.engineer,
    authorName: 'Ines Marlow',
    approverId: null,
    approverName: null,
    publishedAt: null,
    contentSha256: null,
    changeSummary: 'VR from AFM amendment 3.',
  });

describe('RevisionReview', () => {
  let fixture: ComponentFixture<RevisionReview>;
  let backend: HttpTestingController;
  let page: HTMLElement;
  const user = signal<SessionUser>(sessionUser('approver'));

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [RevisionReview],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: AuthService, useValue: { user } }],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RevisionReview);
    page = fixture.nativeElement;
  });

  afterEach(() => backend.verify());

  const TRAINER_CHANGES = [
    { path: 'configurations[landing-flap].positionError.1.casKt', before: 50, after: 51, kind: 'changed' },
    { path: 'speeds[VR@takeoff-flap].referenceKt', before: 55, after: 56, kind: 'changed' },
    { path: 'speeds[VAPP@takeoff-flap]', after: { code: 'VAPP' }, kind: 'added' },
    { path: 'limits.vfeKt.landing-flap', before: 85, after: 87, kind: 'changed' },
  ];

  async function openReview(
    attachments: unknown[] = [],
    {
      content,
      revision = inReview(content),
      changes = TRAINER_CHANGES,
      coverage = (request) => request.flush({ report: smallCoverageReport() }),
    }: { content?: Record<string, unknown>; revision?: ReturnType<typeof inReview>; changes?: unknown[]; coverage?: (request: TestRequest) => void } = {},
  ): Promise<void> {
    fixture.componentRef.setInput('revisionId', IN_REVIEW);
    await fixture.whenStable();
    coverage(backend.expectOne(COVERAGE_PATHS.ofRevision(IN_REVIEW)));
    backend.expectOne(REVISION_PATHS.revision(IN_REVIEW)).flush({ revision });
    backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook([revisionSummary({ id: IN_REVIEW, number: 3, status: 'in_review' }), revisionSummary()]) });
    backend.expectOne(REVISION_PATHS.attachments(IN_REVIEW)).flush({ attachments });
    backend.expectOne(REVISION_PATHS.diff(IN_REVIEW, PUBLISHED)).flush({
      revisionId: IN_REVIEW,
      againstId: PUBLISHED,
      changes,
    });
    await fixture.whenStable();
  }

  const button = (testId: string) => page.querySelector<HTMLButtonElement>(`[data-testid="${testId}"]`);

  function diffRows(): string[][] {
    return Array.from(page.querySelectorAll('[data-testid="diff-table"] tbody tr')).map((row) => [
      row.querySelector('th')!.firstChild!.textContent!.trim(),
      row.querySelector('.kind')!.textContent!.trim(),
      row.querySelector('td.before')!.textContent!.trim(),
      row.querySelector('td.after')!.textContent!.trim(),
    ]);
  }

  it('shows the field-by-field diff against the published revision, in words', async () => {
    user.set(sessionUser('approver'));
    await openReview();
    expect(page.textContent).toContain('4 changes from revision 2');
    expect(diffRows()).toEqual([
      ['Configuration landing-flap › position-error row 2 › CAS (kt)', 'Changed', '50 kt', '51 kt'],
      ['Speed VR (takeoff-flap) › reference speed (kt)', 'Changed', '55 kt', '56 kt'],
      ['Speed VAPP (takeoff-flap)', 'Added', '—', '{ "code": "VAPP" }'],
      ['Limits › VFE landing-flap (kt)', 'Changed', '85 kt', '87 kt'],
    ]);
    expect(page.querySelector('[data-testid="no-sources"]')).not.toBeNull();
  });

  it('shows the diff in the flight manual’s own units with the stored figures beside, and a change of units itself', async () => {
    user.set(sessionUser('approver'));
    // Exact factors: 1 mph = 1609.344/1852 kt, 1 lb = 0.453 592 37 kg (1959 agreement; SI nautical mile).
    const kt = (mph: number) => (mph * 1609.344) / 1852;
    const kg = (lb: number) => lb * 0.45359237;
    const content = { ...(demoPistonTrainerContentRevised() as unknown as Record<string, unknown>), statedUnits: { weight: 'lb', speed: 'mph' } };
    await openReview([], { content, changes: [
      { path: 'weights.maximumTakeoffKg', before: kg(2400), after: kg(2450), kind: 'changed' },
      { path: 'speeds[VX@clean].valuesKt.1.0', before: kt(72), after: kt(73), kind: 'changed' },
      { path: 'speeds[VAPP@takeoff-flap]', after: { code: 'VAPP', kind: 'fixed', valueKt: kt(78) }, kind: 'added' },
      { path: 'limits.vneKt', before: kt(184), after: kt(182), kind: 'changed' },
      { path: 'statedUnits', after: { weight: 'lb', speed: 'mph' }, kind: 'added' },
    ] });
    expect(page.querySelector('[data-testid="review-units"]')?.textContent).toContain('Weights in lb, speeds in mph, as the flight manual of this revision prints them; the stored kg and kt are in brackets.');
    expect(diffRows()).toEqual([
      ['Weights › maximum takeoff weight (lb)', 'Changed', '2400 lb (1088.6 kg)', '2450 lb (1111.3 kg)'],
      ['Speed VX (clean) › table (mph) › entry 2 › entry 1', 'Changed', '72 mph (62.6 kt)', '73 mph (63.4 kt)'],
      ['Speed VAPP (takeoff-flap)', 'Added', '—', '{ "code": "VAPP", "kind": "fixed", "valueKt": "78 mph (67.8 kt)" }'],
      ['Limits › VNE (mph)', 'Changed', '184 mph (159.9 kt)', '182 mph (158.2 kt)'],
      ['Units of the flight manual', 'Added', 'kg, kt (none named)', 'lb, mph'],
    ]);
    // The whole content too, in the manual's units: VNE 160 kt = 184.1247 mph, MTOW 1 100 kg = 2 425.0849 lb.
    expect(page.querySelector('[data-testid="stored-units-note"]')?.textContent).toContain('Weights in lb and speeds in mph, as the flight manual prints them; the book stores kg and kt.');
    const limitsView = page.querySelector('[data-testid="limits-view"]')!.textContent!.replace(/\s+/g, ' ');
    expect(limitsView).toContain('VNE (mph)184.1247');
    expect(page.textContent!.replace(/\s+/g, ' ')).toMatch(/Maximum takeoff weight \(lb\) ?2,425.0849/);
  });

  it('publishes a revision someone else wrote and says so', async () => {
    user.set(sessionUser('approver'));
    await openReview([
      { id: 5, revisionId: IN_REVIEW, originalName: 'afm-5-3.png', contentType: 'image/png', sizeBytes: 2048, sha256: 'b'.repeat(64), uploadedBy: null, createdAt: '2026-11-30T08:00:00.000Z', url: '/api/attachments/5' },
    ]);
    expect(page.querySelector<HTMLImageElement>('[data-testid="source-image"]')?.getAttribute('src')).toBe('/api/attachments/5');
    button('publish')!.click();
    await fixture.whenStable();
    const approve = backend.expectOne({ method: 'POST', url: REVISION_PATHS.step(IN_REVIEW, 'approve') });
    approve.flush({ revision: { ...inReview(), status: 'published', approverId: PEOPLE.approver, approverName: 'Tomas Reyl', publishedAt: '2026-12-01T10:00:00.000Z' } });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="review-outcome"]')?.textContent).toContain('Revision 3 is published and signed');
    expect(button('publish')).toBeNull();
  });

  it('offers no decision on one’s own revision', async () => {
    user.set(sessionUser('approver', PEOPLE.engineer));
    await openReview();
    expect(page.querySelector('[data-testid="own-revision"]')?.textContent).toContain('Nobody approves their own revision');
    expect(button('publish')).toBeNull();
    expect(button('return')).toBeNull();
    // The diff is still there to read.
    expect(diffRows()).toHaveLength(4);
  });

  it('lists the contributors and, to an approver who changed the revision, says why approving is not offered', async () => {
    user.set(sessionUser('approver'));
    const revision = {
      ...inReview(),
      contributors: [
        { userId: PEOPLE.engineer, name: 'Ines Marlow', kinds: ['created' as const] },
        { userId: PEOPLE.approver, name: 'Tomas Reyl', kinds: ['edited' as const, 'submitted' as const] },
      ],
    };
    await openReview([], { revision });
    const listed = Array.from(page.querySelectorAll('[data-testid="contributors"] li')).map((item) => item.textContent!.replace(/\s+/g, ' ').trim());
    expect(listed).toEqual(['Ines Marlow — started it', 'Tomas Reyl — changed it and submitted it']);
    expect(button('publish')).toBeNull();
    expect(page.querySelector('[data-testid="approve-refusal"]')?.textContent).toContain(
      'You changed it and submitted it, so you may not approve revision 3: nobody approves a revision they contributed to.',
    );
    // Returning it to its author is still open to them.
    expect(button('return')).not.toBeNull();
  });

  it('offers approval to an approver who contributed nothing', async () => {
    user.set(sessionUser('approver', PEOPLE.otherApprover));
    await openReview([], { revision: { ...inReview(), contributors: [{ userId: PEOPLE.approver, name: 'Tomas Reyl', kinds: ['edited'] }, { userId: PEOPLE.engineer, name: 'Ines Marlow', kinds: ['created'] }] } });
    expect(button('publish')).not.toBeNull();
    expect(page.querySelector('[data-testid="approve-refusal"]')).toBeNull();
  });

  it('shows the server’s sentence when it refuses an approval with 403', async () => {
    user.set(sessionUser('approver'));
    await openReview();
    button('publish')!.click();
    await fixture.whenStable();
    backend
      .expectOne({ method: 'POST', url: REVISION_PATHS.step(IN_REVIEW, 'approve') })
      .flush({ error: { code: 'forbidden', message: 'Nobody approves their own revision; another approver must.' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="review-action-error"]')?.textContent).toContain('Nobody approves their own revision; another approver must.');
    expect(page.querySelector('[data-testid="review-outcome"]')).toBeNull();
  });

  it('returns a revision only with a reason, and sends that reason', async () => {
    user.set(sessionUser('approver'));
    await openReview();
    button('return')!.click();
    await fixture.whenStable();
    backend.expectNone(REVISION_PATHS.step(IN_REVIEW, 'return'));
    expect(page.querySelector('[data-testid="review-actions"] mat-error')?.textContent?.trim()).toBe('Give the reason.');

    const reason = page.querySelector<HTMLTextAreaElement>('[data-testid="review-actions"] textarea')!;
    reason.value = 'VR does not match the AFM page 5-3 table.';
    reason.dispatchEvent(new Event('input'));
    button('return')!.click();
    await fixture.whenStable();
    const request = backend.expectOne({ method: 'POST', url: REVISION_PATHS.step(IN_REVIEW, 'return') });
    expect(request.request.body).toEqual({ reason: 'VR does not match the AFM page 5-3 table.' });
    request.flush({ revision: { ...inReview(), status: 'draft', returnReason: 'VR does not match the AFM page 5-3 table.' } });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="review-outcome"]')?.textContent).toContain('Revision 3 went back to Ines Marlow as a draft');
  });

  it('shows the coverage picture of the revision under review, with the recorded exceptions beside it', async () => {
    user.set(sessionUser('approver'));
    const content = {
      ...(demoPistonTrainerContentRevised() as unknown as Record<string, unknown>),
      ruleExceptions: [
        { ruleId: 'vref-vmc', reason: 'AFM 4.3: the approach is flown at VREF + 5 with one engine out.' },
        { ruleId: 'vx-vy', reason: 'AFM 5.1: VX and VY are equal above 8,000 ft.' },
      ],
    };
    await openReview([], { content });
    const section = page.querySelector('[data-testid="review-coverage"]')!;
    expect(section.querySelectorAll('[data-testid="coverage-sheet"]')).toHaveLength(2);
    expect(section.querySelector('button.cell[data-outcome="refused"]')?.getAttribute('aria-label')).toBe('3,400 kg, 4,000 ft, +40 °C: card refused');
    expect(section.querySelector('[data-testid="coverage-verdict"]')?.textContent).toContain('The book does not yet cover its envelope.');
    const exceptions = Array.from(section.querySelectorAll('[data-testid="recorded-exceptions"] .exception')).map((e) => e.textContent!.replace(/\s+/g, ' ').trim());
    expect(exceptions).toEqual([
      'VREF ≥ VMC holds everywhere in the envelope AFM 4.3: the approach is flown at VREF + 5 with one engine out.',
      'vx-vy holds everywhere in the envelope AFM 5.1: VX and VY are equal above 8,000 ft.',
    ]);
    // The rule the report finds broken without an exception says so beside it.
    expect(section.querySelector('[data-rule="v1-vr-v2"] [data-testid="rule-no-exception"]')).not.toBeNull();
  });

  it('lists an exception the report carries even when the content read on this page has none', async () => {
    user.set(sessionUser('approver'));
    await openReview();
    const exceptions = Array.from(page.querySelectorAll('[data-testid="recorded-exceptions"] .exception')).map((e) => e.textContent!.replace(/\s+/g, ' ').trim());
    expect(exceptions).toEqual(['VREF ≥ VMC holds everywhere in the envelope AFM 4.3: VMC is the air-minimum control speed with the critical engine out; landing flap approach uses VREF + 5.']);
  });

  it('keeps the review usable when the coverage cannot be had, and tries again on request', async () => {
    user.set(sessionUser('approver'));
    await openReview([], { coverage: (request) => request.error(new ProgressEvent('error'), { status: 0 }) });
    expect(page.querySelector('[data-testid="coverage-error"]')?.textContent).toContain('The coverage could not be shown: Speedwright cannot reach the server.');
    expect(page.querySelector('[data-testid="no-exceptions"]')).not.toBeNull();
    expect(diffRows()).toHaveLength(4);
    expect(button('publish')).not.toBeNull();

    Array.from(page.querySelectorAll<HTMLButtonElement>('[data-testid="coverage-error"] button'))[0]!.click();
    await fixture.whenStable();
    backend.expectOne(COVERAGE_PATHS.ofRevision(IN_REVIEW)).flush({ report: smallCoverageReport() });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="coverage-error"]')).toBeNull();
    expect(page.querySelectorAll('[data-testid="review-coverage"] [data-testid="coverage-sheet"]')).toHaveLength(2);
  });

  it('says before publishing that a failing coverage check will refuse it, and shows the report publish refused with', async () => {
    user.set(sessionUser('approver'));
    const passing = { ...smallCoverageReport(), sheets: [], rules: [], counts: { points: 0, issued: 0, refused: 0, ruleBroken: 0 }, passes: true };
    await openReview([], { coverage: (request) => request.flush({ report: passing }) });
    expect(page.querySelector('[data-testid="coverage-blocks-publish"]')).toBeNull();

    button('publish')!.click();
    await fixture.whenStable();
    backend
      .expectOne({ method: 'POST', url: REVISION_PATHS.step(IN_REVIEW, 'approve') })
      .flush({ error: { code: 'coverage_failed', message: 'The book gives no card at 1 point of its envelope.', report: smallCoverageReport() } }, { status: 422, statusText: 'Unprocessable Content' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="review-action-error"]')?.textContent).toContain('The book gives no card at 1 point of its envelope.');
    expect(page.querySelector('[data-testid="review-coverage"] button.cell[data-outcome="refused"]')?.getAttribute('aria-label')).toBe('3,400 kg, 4,000 ft, +40 °C: card refused');
    expect(page.querySelector('[data-testid="coverage-blocks-publish"]')?.textContent).toContain('publishing will be refused');
    expect(page.querySelector('[data-testid="review-outcome"]')).toBeNull();
  });
});
