import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SessionUser } from '../../../shared/api/auth';
import { demoPistonTrainerContentRevised } from '../../../shared/speed-book/demo-content';
import { AuthService } from '../core/auth/auth-service';
import { PEOPLE, revisionSummary, revisionView, sessionUser, speedBook } from '../speed-books/revision-fixtures';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { RevisionReview } from './revision-review';

jest.setTimeout(30_000);

const IN_REVIEW = 12;
const PUBLISHED = 8;
const inReview = () =>
  revisionView(demoPistonTrainerContentRevised() as unknown as Record<string, unknown>, {
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

  async function openReview(attachments: unknown[] = [], revision = inReview()): Promise<void> {
    fixture.componentRef.setInput('revisionId', IN_REVIEW);
    await fixture.whenStable();
    backend.expectOne(REVISION_PATHS.revision(IN_REVIEW)).flush({ revision });
    backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook([revisionSummary({ id: IN_REVIEW, number: 3, status: 'in_review' }), revisionSummary()]) });
    backend.expectOne(REVISION_PATHS.attachments(IN_REVIEW)).flush({ attachments });
    backend.expectOne(REVISION_PATHS.diff(IN_REVIEW, PUBLISHED)).flush({
      revisionId: IN_REVIEW,
      againstId: PUBLISHED,
      changes: [
        { path: 'configurations[landing-flap].positionError.1.casKt', before: 50, after: 51, kind: 'changed' },
        { path: 'speeds[VR@takeoff-flap].referenceKt', before: 55, after: 56, kind: 'changed' },
        { path: 'speeds[VAPP@takeoff-flap]', after: { code: 'VAPP' }, kind: 'added' },
        { path: 'limits.vfeKt.landing-flap', before: 85, after: 87, kind: 'changed' },
      ],
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
      ['Configuration landing-flap › position-error row 2 › CAS (kt)', 'Changed', '50', '51'],
      ['Speed VR (takeoff-flap) › reference speed (kt)', 'Changed', '55', '56'],
      ['Speed VAPP (takeoff-flap)', 'Added', '—', '{ "code": "VAPP" }'],
      ['Limits › VFE landing-flap (kt)', 'Changed', '85', '87'],
    ]);
    expect(page.querySelector('[data-testid="no-sources"]')).not.toBeNull();
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
    await openReview([], revision);
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
    await openReview([], { ...inReview(), contributors: [{ userId: PEOPLE.approver, name: 'Tomas Reyl', kinds: ['edited'] }, { userId: PEOPLE.engineer, name: 'Ines Marlow', kinds: ['created'] }] });
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
});
