import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { OperatorPerson } from '@shared/api/auth';
import { API_PATHS } from '../core/api/api-paths';
import { AuthService } from '../core/auth/auth-service';
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
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: AuthService, useValue: { user: signal({ id: 1, role: 'admin' }) } },
      ],
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
      Array.from(row.querySelectorAll('td:not(.actions)')).map((cell) =>
        Array.from(cell.childNodes)
          .map((node) => node.textContent!.replace(/\s+/g, ' ').trim())
          .filter(Boolean)
          .join(' '),
      ),
    );
  }

  function names(): string[] {
    return Array.from(page.querySelectorAll('.person-name')).map((cell) => cell.firstChild!.textContent!.trim());
  }

  it("lists the operator's people with role label, account state and last sign-in, by name", async () => {
    await answer({ users: people });
    expect(rows()).toEqual([
      ['Ines Marlow engineer@demo.speedwright.example', 'Fleet engineer', 'mail Invited, no password yet', 'Never'],
      ['Robin Aldane (you) admin@demo.speedwright.example', 'Administrator', 'check_circle Active', '30 Nov 2026, 08:12 UTC'],
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

  function button(root: ParentNode, text: string): HTMLButtonElement | undefined {
    return Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes(text));
  }

  function overlay(): HTMLElement {
    return document.querySelector('.cdk-overlay-container') as HTMLElement;
  }

  async function type(input: HTMLInputElement, value: string): Promise<void> {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  async function chooseFromMenu(person: string, item: string): Promise<void> {
    (page.querySelector(`button[aria-label="Actions for ${person}"]`) as HTMLButtonElement).click();
    await fixture.whenStable();
    const entry = Array.from(overlay().querySelectorAll<HTMLButtonElement>('[mat-menu-item]')).find((b) => b.textContent?.includes(item));
    if (!entry) throw new Error(`No menu item “${item}” for ${person}`);
    entry.click();
    await fixture.whenStable();
  }

  function menuItemsFor(person: string): Promise<string[]> {
    (page.querySelector(`button[aria-label="Actions for ${person}"]`) as HTMLButtonElement).click();
    return fixture.whenStable().then(() => {
      const items = Array.from(overlay().querySelectorAll('[mat-menu-item] .mat-mdc-menu-item-text')).map((b) => b.textContent!.trim());
      document.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape' }));
      return items;
    });
  }

  it('offers each person the actions their account allows', async () => {
    await answer({ users: people });
    expect(await menuItemsFor('Ines Marlow')).toEqual(['Change role or name…', 'Send the invitation again', 'Lock account']);
    await fixture.whenStable();
    expect(await menuItemsFor('Sam Hollis')).toEqual(['Change role or name…', 'Unlock account']);
  });

  it('invites a person: checks the fields, shows the server’s sentence under the e-mail, then adds the row', async () => {
    await answer({ users: people });
    button(page, 'Invite a person')!.click();
    await fixture.whenStable();
    const dialog = overlay().querySelector('sw-invite-person-dialog') as HTMLElement;

    button(dialog, 'Send invitation')!.click();
    await fixture.whenStable();
    expect(dialog.textContent).toContain('Enter an e-mail address such as name@example.com.');
    expect(dialog.textContent).toContain('Enter the name colleagues know this person by.');
    expect(dialog.textContent).toContain('Choose the role this person will have.');

    const [email, name] = Array.from(dialog.querySelectorAll<HTMLInputElement>('input[matinput]'));
    await type(email, ' Lee.Quarry@Demo.Speedwright.Example ');
    await type(name, 'Lee Quarry');
    (dialog.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    Array.from(overlay().querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.includes('Inspector'))!.click();
    await fixture.whenStable();
    expect(dialog.textContent).toContain('Reads published data, revision history, the audit trail and the card log');
    button(dialog, 'Send invitation')!.click();
    await fixture.whenStable();

    const refused = backend.expectOne({ method: 'POST', url: API_PATHS.users });
    expect(refused.request.body).toEqual({ email: 'lee.quarry@demo.speedwright.example', displayName: 'Lee Quarry', role: 'inspector' });
    refused.flush(
      { error: { code: 'email_taken', message: 'This e-mail address already belongs to an account.', fields: { email: 'This e-mail address already belongs to an account.' } } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(email.closest('mat-form-field')!.querySelector('mat-error')?.textContent?.trim()).toBe('This e-mail address already belongs to an account.');

    await type(email, 'lee.q@demo.speedwright.example');
    button(dialog, 'Send invitation')!.click();
    await fixture.whenStable();
    const invited: OperatorPerson = { id: 9, email: 'lee.q@demo.speedwright.example', displayName: 'Lee Quarry', role: 'inspector', locked: false, invitationPending: true, lastSignInAt: null, createdAt: '2026-12-01T00:00:00.000Z' };
    backend.expectOne({ method: 'POST', url: API_PATHS.users }).flush({ user: invited, mailSent: true }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(names()).toEqual(['Ines Marlow', 'Lee Quarry', 'Robin Aldane', 'Sam Hollis']);
    expect(overlay().textContent).toContain('An invitation is on its way to lee.q@demo.speedwright.example.');
  });

  it('shows the server’s refusal to demote the last administrator as a sentence', async () => {
    await answer({ users: people });
    await chooseFromMenu('Robin Aldane', 'Change role or name');
    const dialog = overlay().querySelector('sw-change-person-dialog') as HTMLElement;
    (dialog.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    Array.from(overlay().querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.includes('Approver'))!.click();
    await fixture.whenStable();
    button(dialog, 'Save changes')!.click();
    await fixture.whenStable();
    const request = backend.expectOne({ method: 'PATCH', url: `${API_PATHS.users}/1` });
    expect(request.request.body).toEqual({ role: 'approver' });
    const sentence = "Robin Aldane is the operator's only administrator who can sign in. Make someone else an administrator first.";
    request.flush({ error: { code: 'last_admin', message: sentence } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(dialog.querySelector('[data-testid="dialog-error"]')?.textContent?.trim()).toBe(sentence);
    expect(rows()[1][1]).toBe('Administrator');
  });

  it('locks and unlocks a person, and shows why locking oneself is refused', async () => {
    await answer({ users: people });
    await chooseFromMenu('Sam Hollis', 'Unlock account');
    const unlock = backend.expectOne({ method: 'PATCH', url: `${API_PATHS.users}/2` });
    expect(unlock.request.body).toEqual({ locked: false });
    unlock.flush({ user: { ...people[1], locked: false } });
    await fixture.whenStable();
    expect(rows()[2][2]).toBe('check_circle Active');

    await chooseFromMenu('Robin Aldane', 'Lock account');
    const sentence = 'You cannot lock your own account. Ask another administrator if it must be locked.';
    backend
      .expectOne({ method: 'PATCH', url: `${API_PATHS.users}/1` })
      .flush({ error: { code: 'cannot_lock_self', message: sentence, fields: { locked: 'You cannot lock your own account.' } } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="people-refusal"]')?.textContent?.trim()).toBe(sentence);
    expect(rows()[1][2]).toBe('check_circle Active');
    button(page, 'close')!.click();
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="people-refusal"]')).toBeNull();
  });

  it('sends an invitation again and says so when the mail server did not take it', async () => {
    await answer({ users: people });
    await chooseFromMenu('Ines Marlow', 'Send the invitation again');
    backend.expectOne({ method: 'POST', url: `${API_PATHS.users}/3/invitation` }).flush({ user: people[2], mailSent: false }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="people-refusal"]')?.textContent).toContain(
      'Ines Marlow is given a new link, but the mail server did not take the invitation.',
    );
  });
});
