import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { SessionUser } from '@shared/api/auth';
import { Role, can } from '@shared/auth/roles';
import { APP_NAVIGATION } from '../app.navigation';
import { AuthService } from '../core/auth/auth-service';
import { NAVIGATION_ENTRIES } from '../core/navigation/navigation-entry';
import { NavigationList } from './navigation-list';

function personWith(role: Role): SessionUser {
  return { id: 1, email: `${role}@demo.speedwright.example`, displayName: 'Test Person', role, operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
}

describe('NavigationList', () => {
  const user = signal<SessionUser | null>(null);

  async function linksFor(person: SessionUser | null): Promise<{ label: string; href: string | null }[]> {
    user.set(person);
    const fixture = TestBed.createComponent(NavigationList);
    await fixture.whenStable();
    const list = fixture.nativeElement.querySelector('[data-testid="nav-list"]') as HTMLElement;
    return Array.from(list.querySelectorAll('a')).map((a) => ({ label: a.textContent!.trim(), href: a.getAttribute('href') }));
  }

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [NavigationList],
      providers: [
        provideRouter([]),
        { provide: AuthService, useValue: { user } },
        { provide: NAVIGATION_ENTRIES, useValue: APP_NAVIGATION },
      ],
    });
  });

  it('shows the admin People, Fleet, the audit trail and the mailbox', async () => {
    const hrefs = (await linksFor(personWith('admin'))).map((l) => l.href);
    expect(hrefs[0]).toBe('/home');
    expect(hrefs).toEqual(expect.arrayContaining(['/fleet', '/people', '/audit', '/mailbox']));
  });

  it.each<Role>(['pilot', 'engineer', 'approver', 'inspector'])('shows a %s Fleet but not People or the mailbox', async (role) => {
    const hrefs = (await linksFor(personWith(role))).map((l) => l.href);
    expect(hrefs).toContain('/fleet');
    expect(hrefs).not.toContain('/people');
    expect(hrefs).not.toContain('/mailbox');
  });

  it.each<[Role, boolean]>([
    ['pilot', false],
    ['engineer', false],
    ['approver', true],
    ['inspector', true],
  ])('shows a %s the audit trail: %s', async (role, shown) => {
    const hrefs = (await linksFor(personWith(role))).map((l) => l.href);
    expect(hrefs.includes('/audit')).toBe(shown);
  });

  it.each<Role>(['pilot', 'engineer', 'approver', 'admin', 'inspector'])(
    'lists for a %s exactly the entries their role may open, in declared order',
    async (role) => {
      const expected = APP_NAVIGATION.filter((entry) => entry.capability === null || can(role, entry.capability)).map((entry) => `/${entry.path}`);
      expect((await linksFor(personWith(role))).map((l) => l.href)).toEqual(expected);
    },
  );

  it('shows nothing when nobody is signed in', async () => {
    expect(await linksFor(null)).toEqual([]);
  });

  it('follows a change of person without being recreated', async () => {
    user.set(personWith('pilot'));
    const fixture = TestBed.createComponent(NavigationList);
    await fixture.whenStable();
    const hrefs = () => Array.from<HTMLAnchorElement>(fixture.nativeElement.querySelectorAll('a')).map((a) => a.getAttribute('href'));
    expect(hrefs()).not.toContain('/people');
    user.set(personWith('admin'));
    await fixture.whenStable();
    expect(hrefs()).toContain('/people');
  });
});
