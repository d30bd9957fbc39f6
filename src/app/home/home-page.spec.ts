import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { SessionUser } from '@shared/api/auth';
import { ROLE_SUMMARIES, Role, can } from '@shared/auth/roles';
import { APP_NAVIGATION } from '../app.navigation';
import { AuthService } from '../core/auth/auth-service';
import { NAVIGATION_ENTRIES } from '../core/navigation/navigation-entry';
import { ThemePreference } from '../core/theme/theme-preference';
import { HomePage } from './home-page';

function personWith(role: Role): SessionUser {
  return { id: 9, email: `${role}@demo.speedwright.example`, displayName: 'Alex Thorne', role, operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
}

describe('HomePage', () => {
  const user = signal<SessionUser | null>(null);
  const isNight = signal(false);
  const theme = { isNight, toggle: jest.fn(() => isNight.update((night) => !night)) };

  beforeEach(() => {
    isNight.set(false);
    theme.toggle.mockClear();
    TestBed.configureTestingModule({
      imports: [HomePage],
      providers: [
        provideRouter([]),
        { provide: AuthService, useValue: { user } },
        { provide: ThemePreference, useValue: theme },
        { provide: NAVIGATION_ENTRIES, useValue: APP_NAVIGATION },
      ],
    });
  });

  async function render(role: Role): Promise<HTMLElement> {
    user.set(personWith(role));
    const fixture = TestBed.createComponent(HomePage);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  it('says who you are and for which operator', async () => {
    const page = await render('engineer');
    const text = page.textContent!;
    expect(page.querySelector('h1')?.textContent?.trim()).toBe('Alex Thorne');
    expect(text).toContain('engineer@demo.speedwright.example');
    expect(page.querySelector('[data-testid="home-role"]')?.textContent?.trim()).toBe('Fleet engineer');
    expect(text).toContain('Kestrel Fen Aviation (demo)');
    expect(text).toContain(ROLE_SUMMARIES.engineer);
  });

  it("lists what the pilot's role may do, and nothing it may not", async () => {
    const items = Array.from((await render('pilot')).querySelectorAll('.may-do li')).map((li) => li.textContent?.trim());
    expect(items).toEqual([
      "Read your operator's published speed books and revisions.",
      'Prepare and issue speed cards for the weight and conditions of a flight.',
      'Check whether a speed card was built from the revision that is current now.',
    ]);
  });

  it('offers the admin the people page as a next step', async () => {
    const steps = (await render('admin')).querySelector('[data-testid="next-steps"]')!;
    const link = Array.from(steps.querySelectorAll('a')).find((a) => a.textContent?.includes('People'));
    expect(link?.getAttribute('href')).toBe('/people');
  });

  it('offers a pilot no page their role may not open', async () => {
    const steps = (await render('pilot')).querySelector('[data-testid="next-steps"]')!;
    const hrefs = Array.from(steps.querySelectorAll('a')).map((a) => a.getAttribute('href'));
    const mayOpen = APP_NAVIGATION.filter((entry) => entry.path !== 'home' && (entry.capability === null || can('pilot', entry.capability)));
    expect(hrefs).toEqual(mayOpen.map((entry) => `/${entry.path}`));
    expect(hrefs).toContain('/fleet');
    expect(hrefs).not.toContain('/people');
    expect(steps.textContent).toContain('Use the night theme');
  });

  it('switches the theme from the next steps', async () => {
    user.set(personWith('inspector'));
    const fixture = TestBed.createComponent(HomePage);
    await fixture.whenStable();
    const button = Array.from<HTMLButtonElement>(fixture.nativeElement.querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Use the night theme'),
    )!;
    button.click();
    await fixture.whenStable();
    expect(theme.toggle).toHaveBeenCalledTimes(1);
    expect(button.textContent).toContain('Use the day theme');
  });
});
