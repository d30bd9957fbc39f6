import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { OperatorPerson } from '../../../shared/api/auth';
import { API_PATHS } from '../core/api/api-paths';
import { PeoplePage } from './people-page';

const people: OperatorPerson[] = [
  { id: 1, email: 'admin@demo.speedwright.example', displayName: 'Robin Aldane', role: 'admin', locked: false, invitationPending: false, lastSignInAt: '2026-11-30T08:12:00.000Z', createdAt: '2026-01-01T00:00:00.000Z' },
  { id: 2, email: 'pilot@demo.speedwright.example', displayName: 'Sam Hollis', role: 'pilot', locked: true, invitationPending: false, lastSignInAt: '2026-10-02T06:00:00.000Z', createdAt: '2026-01-01T00:00:00.000Z' },
  { id: 3, email: 'engineer@demo.speedwright.example', displayName: 'Ines Marlow', role: 'engineer', locked: false, invitationPending: true, lastSignInAt: null, createdAt: '2026-01-01T00:00:00.000Z' },
];

describe('PeoplePage', () => {
  let fixture: ComponentFixture<PeoplePage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [PeoplePage],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PeoplePage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function answer(body: unknown, status = 200): Promise<void> {
    backend.expectOne(API_PATHS.users).flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
  }

  function rows(): string[][] {
    return Array.from(page.querySelectorAll('tr.mat-mdc-row')).map((row) =>
      Array.from(row.querySelectorAll('td')).map((cell) =>
        Array.from(cell.childNodes)
          .map((node) => node.textContent!.replace(/\s+/g, ' ').trim())
          .filter(Boolean)
          .join(' '),
      ),
    );
  }

  function names(): string[] {
    return Array.from(page.querySelectorAll('.person-name')).map((cell) => cell.textContent!.trim());
  }

  it("lists the operator's people with role label, account state and last sign-in, by name", async () => {
    await answer({ users: people });
    expect(rows()).toEqual([
      ['Ines Marlow engineer@demo.speedwright.example', 'Fleet engineer', 'mail Invited, no password yet', 'Never'],
      ['Robin Aldane admin@demo.speedwright.example', 'Administrator', 'check_circle Active', '30 Nov 2026, 08:12 UTC'],
      ['Sam Hollis pilot@demo.speedwright.example', 'Pilot', 'lock Locked', '2 Oct 2026, 06:00 UTC'],
    ]);
    expect(page.querySelector('[data-testid="people-count"]')?.textContent?.trim()).toBe('3 people');
  });

  it('filters by name, e-mail, role or account state and says how many it shows', async () => {
    await answer({ users: people });
    const filter = page.querySelector('input[type="search"]') as HTMLInputElement;

    filter.value = 'locked';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(names()).toEqual(['Sam Hollis']);
    expect(page.querySelector('[data-testid="people-count"]')?.textContent?.trim()).toBe('Showing 1 of 3 people');

    filter.value = 'ADMINISTRATOR';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(names()).toEqual(['Robin Aldane']);

    filter.value = 'nobody-like-this';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(names()).toEqual([]);
    expect(page.textContent).toContain('No one matches “nobody-like-this”.');
  });

  it('sorts by a column header, and the other way round on a second click', async () => {
    await answer({ users: people });
    const header = Array.from(page.querySelectorAll<HTMLElement>('th')).find((th) => th.textContent?.includes('Last sign-in'))!;
    header.querySelector<HTMLElement>('.mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(names()).toEqual(['Ines Marlow', 'Sam Hollis', 'Robin Aldane']);

    header.querySelector<HTMLElement>('.mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(names()).toEqual(['Robin Aldane', 'Sam Hollis', 'Ines Marlow']);
  });

  it('shows the sentence of a failed request and loads again on request', async () => {
    await answer({ error: { code: 'forbidden', message: 'Only an administrator may list people.' } }, 403);
    expect(page.querySelector('[data-testid="people-error"]')?.textContent?.trim()).toBe('Only an administrator may list people.');

    Array.from(page.querySelectorAll('button')).find((b) => b.textContent?.includes('Try again'))!.click();
    await answer({ users: people });
    expect(page.querySelector('[data-testid="people-error"]')).toBeNull();
    expect(rows()).toHaveLength(3);
  });

  it('refuses a list of the wrong shape with a clear sentence', async () => {
    await answer({ users: [{ id: 1, email: 'x' }] });
    expect(page.querySelector('[data-testid="people-error"]')?.textContent).toContain('does not understand');
    expect(rows()).toHaveLength(0);
  });
});
