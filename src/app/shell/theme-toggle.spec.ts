import { MediaMatcher } from '@angular/cdk/layout';
import { TestBed } from '@angular/core/testing';
import { NIGHT_THEME_CLASS, THEME_STORAGE_KEY } from '../core/theme/theme-preference';
import { ThemeToggle } from './theme-toggle';

describe('ThemeToggle', () => {
  beforeEach(() => {
    localStorage.clear();
    document.documentElement.classList.remove(NIGHT_THEME_CLASS);
    TestBed.configureTestingModule({
      imports: [ThemeToggle],
      providers: [
        {
          provide: MediaMatcher,
          // The tooltip's breakpoint observer listens too, so the stub takes listeners.
          useValue: { matchMedia: (media: string) => ({ media, matches: false, addListener: () => undefined, removeListener: () => undefined }) },
        },
      ],
    });
  });

  it('switches to night and back, says so to assistive technology, and persists', async () => {
    const fixture = TestBed.createComponent(ThemeToggle);
    await fixture.whenStable();
    const button = fixture.nativeElement.querySelector('button') as HTMLButtonElement;
    expect(button.getAttribute('aria-label')).toBe('Night theme');
    expect(button.getAttribute('aria-pressed')).toBe('false');

    button.click();
    await fixture.whenStable();
    expect(button.getAttribute('aria-pressed')).toBe('true');
    expect(document.documentElement.classList.contains(NIGHT_THEME_CLASS)).toBe(true);
    expect(localStorage.getItem(THEME_STORAGE_KEY)).toBe('night');

    button.click();
    await fixture.whenStable();
    expect(button.getAttribute('aria-pressed')).toBe('false');
    expect(localStorage.getItem(THEME_STORAGE_KEY)).toBe('day');
  });
});
