import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { AuditEventView } from '@shared/api/audit';
import { Role } from '@shared/auth/roles';
import { API_PATHS } from '../core/api/api-paths';
import { AuthService } from '../core/auth/auth-service';
import { AUDIT_PAGE_SIZE, AuditPage } from './audit-page';

const events: AuditEventView[] = [
  {
    id: 40,
    action: 'airframe.updated',
    entityType: 'airframe',
    entityId: '12',
    actorId: 1,
    actorName: 'Robin Aldane',
    details: { active: { before: true, after: false } },
    ip: '192.0.2.7',
    userAgent: 'Mozilla/5.0 (X11; Linux x86_64)',
    createdAt: '2026-11-30T08:12:05.000Z',
  },
  {
    id: 39,
    action: 'user.password-reset-requested',
    entityType: 'user',
    entityId: '2',
    actorId: null,
    actorName: null,
    details: null,
    ip: null,
    userAgent: null,
    createdAt: '2026-11-29T22:00:00.000Z',
  },
  {
    id: 38,
    action: 'user.invited',
    entityType: 'user',
    entityId: '3',
    actorId: 4,
    actorName: 'Ines Marlow',
    details: { email: 'lee@demo.example', role: 'inspector' },
    ip: '198.51.100.2',
    userAgent: null,
    createdAt: '2026-11-28T10:00:00.000Z',
  },
];

describe('AuditPage', () => {
  let fixture: ComponentFixture<AuditPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  async function open(role: Role): Promise<void> {
    TestBed.configureTestingModule({
      imports: [AuditPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: AuthService, useValue: { user: signal({ id: 1, role }) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AuditPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function auditRequest(): TestRequest {
    return backend.expectOne((request) => request.url.startsWith(API_PATHS.audit));
  }

  function query(request: TestRequest): Record<string, string> {
    return Object.fromEntries(new URL(request.request.url, 'http://x').searchParams);
  }

  async function flush(request: TestRequest, body: unknown, status = 200): Promise<void> {
    request.flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
  }

  function rows(): string[][] {
    return Array.from(page.querySelectorAll('tr.event-row')).map((row) =>
      Array.from(row.querySelectorAll('td:not(.expand)')).map((cell) => cell.textContent!.trim()),
    );
  }

  async function choose(label: string, option: string): Promise<void> {
    const field = Array.from(page.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
    (field.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll<HTMLElement>('.cdk-overlay-container mat-option'));
    const match = options.find((o) => o.textContent?.trim() === option);
    if (!match) throw new Error(`No option “${option}” in ${label}: ${options.map((o) => o.textContent?.trim()).join(', ')}`);
    match.click();
    await fixture.whenStable();
  }

  /** The filter waits for a pause in typing before it asks the server. */
  async function afterPause(): Promise<void> {
    await new Promise((done) => setTimeout(done, 350));
    await fixture.whenStable();
  }

  it('lists the newest events first in plain words, times in UTC', async () => {
    await open('inspector');
    const request = auditRequest();
    expect(query(request)).toEqual({ limit: String(AUDIT_PAGE_SIZE) });
    await flush(request, { events, nextCursor: null });
    expect(rows()).toEqual([
      ['30 Nov 2026, 08:12:05 UTC', 'Robin Aldane', 'Changed an airframe', 'Airframe #12'],
      ['29 Nov 2026, 22:00:00 UTC', 'Nobody signed in', 'Asked for a password reset', 'Person #2'],
      ['28 Nov 2026, 10:00:00 UTC', 'Ines Marlow', 'Invited a person', 'Person #3'],
    ]);
  });

  it('opens the details of an event: changes as before → after, address and browser', async () => {
    await open('inspector');
    await flush(auditRequest(), { events, nextCursor: null });
    expect(page.querySelector('[data-testid="audit-details"]')).toBeNull();
    const toggle = page.querySelector('button[aria-label^="Show details of Changed an airframe"]') as HTMLButtonElement;
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    toggle.click();
    await fixture.whenStable();
    const details = Array.from(page.querySelectorAll('[data-testid="audit-details"] dt')).map((dt) => `${dt.textContent!.trim()}: ${dt.nextElementSibling!.textContent!.trim()}`);
    expect(details).toEqual(['Active: true → false', 'From address: 192.0.2.7', 'Browser or device: Mozilla/5.0 (X11; Linux x86_64)']);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
  });

  it('filters by record and action, narrowing the actions to the record chosen, and by the people seen', async () => {
    await open('approver');
    await flush(auditRequest(), { events, nextCursor: null });

    await choose('Record', 'Person');
    await afterPause();
    expect(query(auditRequest())).toEqual({ limit: '25', entityType: 'user' });
    // Only the actions on people are offered now.
    const actionField = Array.from(page.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === 'Action')!;
    (actionField.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    const offered = Array.from(document.querySelectorAll('.cdk-overlay-container mat-option')).map((o) => o.textContent!.trim());
    expect(offered).toContain('Invited a person');
    expect(offered).not.toContain('Added an airframe');
    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape' }));
    (document.querySelector('.cdk-overlay-backdrop') as HTMLElement | null)?.click();
    await fixture.whenStable();
    await choose('Action', 'Locked an account');
    await afterPause();
    const byAction = auditRequest();
    expect(query(byAction)).toEqual({ limit: '25', entityType: 'user', action: 'user.locked' });
    await flush(byAction, { events: [], nextCursor: null });
    expect(page.textContent).toContain('No event matches these filters.');

    await choose('Person', 'Ines Marlow');
    await afterPause();
    expect(query(auditRequest())).toEqual({ limit: '25', entityType: 'user', action: 'user.locked', actorId: '4' });
  });

  it('filters by whole UTC days and refuses a range that ends before it starts', async () => {
    await open('inspector');
    await flush(auditRequest(), { events, nextCursor: null });
    const [from, to] = Array.from(page.querySelectorAll<HTMLInputElement>('input[type="date"]'));
    from.value = '2026-11-29';
    from.dispatchEvent(new Event('input'));
    to.value = '2026-11-30';
    to.dispatchEvent(new Event('input'));
    await afterPause();
    expect(query(auditRequest())).toEqual({ limit: '25', from: '2026-11-29T00:00:00.000Z', to: '2026-11-30T23:59:59.999Z' });

    to.value = '2026-11-01';
    to.dispatchEvent(new Event('input'));
    await afterPause();
    expect(page.querySelector('[data-testid="audit-filter-problem"]')?.textContent?.trim()).toBe(
      'The “from” date is after the “to” date. Change one of them.',
    );
    backend.expectNone((request) => request.url.startsWith(API_PATHS.audit));
  });

  it('pages to older events with the cursor and back to newer ones', async () => {
    await open('inspector');
    await flush(auditRequest(), { events, nextCursor: '38' });
    const newer = Array.from(page.querySelectorAll<HTMLButtonElement>('.pager button'))[0];
    const older = Array.from(page.querySelectorAll<HTMLButtonElement>('.pager button'))[1];
    expect(newer.disabled).toBe(true);
    older.click();
    await fixture.whenStable();
    const second = auditRequest();
    expect(query(second)).toEqual({ limit: '25', cursor: '38' });
    await flush(second, { events: [{ ...events[2], id: 37, action: 'revision.approved', entityType: 'revision', entityId: '5' }], nextCursor: null });
    expect(page.querySelector('[data-testid="audit-page-number"]')?.textContent?.trim()).toBe('Page 2');
    expect(rows()[0][2]).toBe('Approved and published a revision');
    expect(older.disabled).toBe(true);

    newer.click();
    await fixture.whenStable();
    const first = auditRequest();
    expect(query(first)).toEqual({ limit: '25' });
    await flush(first, { events, nextCursor: '38' });
    expect(page.querySelector('[data-testid="audit-page-number"]')?.textContent?.trim()).toBe('Page 1');
  });

  it('offers an admin every person of the operator in the person filter', async () => {
    await open('admin');
    backend.expectOne(API_PATHS.users).flush({
      users: [
        { id: 7, email: 'a@x.example', displayName: 'Zoe Calder', role: 'pilot', locked: false, invitationPending: false, lastSignInAt: null, createdAt: '2026-01-01T00:00:00.000Z' },
      ],
    });
    await flush(auditRequest(), { events, nextCursor: null });
    const field = Array.from(page.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === 'Person')!;
    (field.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll('.cdk-overlay-container mat-option')).map((o) => o.textContent!.trim());
    expect(options).toEqual(['Anyone', 'Ines Marlow', 'Robin Aldane', 'Zoe Calder']);
  });

  it('shows the server’s sentence for a refused filter and tries again on request', async () => {
    await open('inspector');
    await flush(auditRequest(), { error: { code: 'invalid_request', message: 'Some fields of the audit filter are not right.' } }, 400);
    expect(page.querySelector('[data-testid="audit-error"]')?.textContent?.trim()).toBe('Some fields of the audit filter are not right.');
    Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Try again'))!.click();
    await fixture.whenStable();
    await flush(auditRequest(), { events, nextCursor: null });
    expect(rows()).toHaveLength(3);
  });

  it('names card and signing-key events in words and files card issues under speed cards', async () => {
    await open('inspector');
    await flush(auditRequest(), {
      events: [{ ...events[0], id: 50, action: 'card.issued', entityType: 'card-issue', entityId: 'KF-7Q2', details: null }],
      nextCursor: null,
    });
    expect(rows()[0].slice(2)).toEqual(['Issued a speed card', 'Speed card #KF-7Q2']);
    await choose('Record', 'Speed card');
    await afterPause();
    await flush(auditRequest(), { events: [], nextCursor: null });
    await choose('Action', 'Issued a speed card');
    await afterPause();
    expect(query(auditRequest())).toEqual({ limit: '25', entityType: 'card-issue', action: 'card.issued' });
  });
});
