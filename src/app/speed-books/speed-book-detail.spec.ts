import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { SessionUser } from '@shared/api/auth';
import type { Role } from '@shared/auth/roles';
import { AuthService } from '../core/auth/auth-service';
import { AIRCRAFT_TYPES, revisionSummary, revisionView, sessionUser, speedBook } from './testing/revision-fixtures';
import { REVISION_PATHS } from './revisions-api';
import { SpeedBookDetail } from './speed-book-detail';

jest.setTimeout(30_000);

const history = () => [
  revisionSummary(),
  revisionSummary({ id: 7, number: 1, status: 'superseded', changeSummary: 'First issue.', supersededAt: '2026-11-21T10:30:00.000Z', publishedAt: '2026-06-01T09:00:00.000Z' }),
];

describe('SpeedBookDetail', () => {
  let fixture: ComponentFixture<SpeedBookDetail>;
  let backend: HttpTestingController;
  let page: HTMLElement;
  const user = signal<SessionUser>(sessionUser('pilot'));

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [SpeedBookDetail],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: AuthService, useValue: { user } }],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function open(role: Role, revisions = history()): Promise<void> {
    user.set(sessionUser(role));
    fixture = TestBed.createComponent(SpeedBookDetail);
    page = fixture.nativeElement;
    fixture.componentRef.setInput('bookId', 1);
    await fixture.whenStable();
    backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook(revisions) });
    backend.expectOne(REVISION_PATHS.aircraftTypes).flush({ aircraftTypes: AIRCRAFT_TYPES });
    await fixture.whenStable();
  }

  const rows = () => Array.from(page.querySelectorAll('[data-testid="revision-history"] tbody tr'));
  const actionsOf = (row: Element) => Array.from(row.querySelectorAll('.actions a, .actions button')).map((a) => a.textContent!.trim());

  it('shows a pilot the current revision and the history, with nothing to change', async () => {
    await open('pilot');
    expect(page.querySelector('h1')?.textContent).toBe('Sedgeling 4 speed book');
    expect(page.querySelector('[data-testid="current-revision"]')?.textContent).toContain('Current: revision 2, published 21 Nov 2026, 10:30 UTC');
    expect(rows().map((row) => row.querySelector('[data-testid="revision-status"]')?.textContent?.trim())).toEqual(['verifiedPublished', 'historySuperseded']);
    expect(rows()[0]!.textContent).toContain('Ines Marlow');
    expect(rows()[0]!.textContent).toContain('Tomas Reyl');
    expect(rows()[0]!.textContent).toContain('VR and VX from AFM amendment 2.');
    expect(rows().map(actionsOf)).toEqual([['View'], ['View']]);
    expect(page.querySelector('[data-testid="new-draft-summary"]')).toBeNull();
  });

  it('lets an engineer start a draft from the published revision, with a change summary', async () => {
    await open('engineer');
    expect(rows().map(actionsOf)).toEqual([['View'], ['View']]);
    const start = Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Start draft'))!;
    start.click();
    await fixture.whenStable();
    backend.expectNone(REVISION_PATHS.newRevision(1));
    expect(page.querySelector('form mat-error')?.textContent?.trim()).toBe('Say in a sentence what this revision changes.');

    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const summary = page.querySelector<HTMLTextAreaElement>('[data-testid="new-draft-summary"]')!;
    summary.value = 'VR from AFM amendment 3.';
    summary.dispatchEvent(new Event('input'));
    start.click();
    await fixture.whenStable();
    const request = backend.expectOne({ method: 'POST', url: REVISION_PATHS.newRevision(1) });
    // A published revision exists, so the server copies its content.
    expect(request.request.body).toEqual({ changeSummary: 'VR from AFM amendment 3.' });
    request.flush({ revision: revisionView({}, { id: 13, number: 3, status: 'draft' }) }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/drafts'], { queryParams: { revision: 13 } });
  });

  it('points an engineer at the open draft instead of offering a second one', async () => {
    await open('engineer', [revisionSummary({ id: 13, number: 3, status: 'draft', publishedAt: null, approverId: null, approverName: null }), ...history()]);
    expect(page.querySelector('[data-testid="open-revision"]')?.textContent).toContain('Revision 3 is a draft');
    expect(page.querySelector('[data-testid="new-draft-summary"]')).toBeNull();
    expect(actionsOf(rows()[0]!)).toEqual(['View', 'Edit']);
  });

  it('lets an approver withdraw the published revision, with a reason', async () => {
    await open('approver');
    expect(rows().map(actionsOf)).toEqual([['View', 'Withdraw'], ['View']]);
    (rows()[0]!.querySelector('.actions button') as HTMLButtonElement).click();
    await fixture.whenStable();
    const form = page.querySelector('[data-testid="withdraw-form"]')!;
    const reason = form.querySelector('textarea')!;
    reason.value = 'VNE figure mistyped; revision 3 follows.';
    reason.dispatchEvent(new Event('input'));
    form.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    const request = backend.expectOne({ method: 'POST', url: REVISION_PATHS.step(8, 'withdraw') });
    expect(request.request.body).toEqual({ reason: 'VNE figure mistyped; revision 3 follows.' });
    request.flush({ revision: revisionView({}, { status: 'withdrawn' }) });
    await fixture.whenStable();
    // The speed book is read again to show the withdrawal.
    backend.expectOne(REVISION_PATHS.speedBook(1)).flush({ speedBook: speedBook([revisionSummary({ status: 'withdrawn', withdrawnAt: '2026-12-01T11:00:00.000Z' }), history()[1]!]) });
    backend.expectOne(REVISION_PATHS.aircraftTypes).flush({ aircraftTypes: AIRCRAFT_TYPES });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="current-revision"]')?.textContent).toContain('No revision is published');
    expect(page.querySelector('[data-testid="withdraw-form"]')).toBeNull();
  });

  it('says so when the speed book does not exist', async () => {
    user.set(sessionUser('pilot'));
    fixture = TestBed.createComponent(SpeedBookDetail);
    page = fixture.nativeElement;
    fixture.componentRef.setInput('bookId', 99);
    await fixture.whenStable();
    const types = backend.expectOne(REVISION_PATHS.aircraftTypes);
    backend.expectOne(REVISION_PATHS.speedBook(99)).flush({ error: { code: 'not_found', message: 'That speed book does not exist.' } }, { status: 404, statusText: 'Not Found' });
    expect(types.cancelled).toBe(true);
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="speed-book-error"]')?.textContent).toBe('That speed book does not exist.');
  });
});
