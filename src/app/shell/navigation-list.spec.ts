import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { SessionUser } from '../../../shared/api/auth';
import { Role } from '../../../shared/auth/roles';
import { APP_NAVIGATION } from '../app.navigation';
import { AuthService } from '../core/auth/auth-service';
import { NAVIGATION_ENTRIES } from '../core/navigation/navigation-entry';
import { NavigationList } from './navigation-list';

function personWith(role: Role): SessionUser {
  return { id: 1, email: `${role}@demo.speedwright.example`, displayName: 'Test Person', role, operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)' };
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

  it('shows People to an admin', async () => {
    expect(await linksFor(personWith('admin'))).toEqual([
      { label: expect.stringContaining('Home'), href: '/home' },
      { label: expect.stringContaining('People'), href: '/people' },
    ]);
  });

  it.each<Role>(['pilot', 'engineer', 'approver', 'inspector'])('does not show People to a %s', async (role) => {
    const links = await linksFor(personWith(role));
    expect(links.map((l) => l.href)).toEqual(['/home']);
  });

  it('shows nothing when nobody is signed in', async () => {
    expect(await linksFor(null)).toEqual([]);
  });

  it('follows a change of person without being recreated', async () => {
    user.set(personWith('pilot'));
    const fixture = TestBed.createComponent(NavigationList);
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelectorAll('a')).toHaveLength(1);
    user.set(personWith('admin'));
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelectorAll('a')).toHaveLength(2);
  });
});
