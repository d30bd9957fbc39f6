import { MediaMatcher } from '@angular/cdk/layout';
import { DOCUMENT } from '@angular/common';
import { TestBed } from '@angular/core/testing';
import { NIGHT_THEME_CLASS, THEME_STORAGE_KEY, ThemePreference } from './theme-preference';

describe('ThemePreference', () => {
  let prefersDark: boolean;

  beforeEach(() => {
    prefersDark = false;
    localStorage.clear();
    document.documentElement.classList.remove(NIGHT_THEME_CLASS);
    TestBed.configureTestingModule({
      providers: [{ provide: MediaMatcher, useValue: { matchMedia: (query: string) => ({ matches: query.includes('dark') && prefersDark }) } }],
    });
  });

  function root(): HTMLElement {
    return TestBed.inject(DOCUMENT).documentElement;
  }

  it('starts in the day theme on a first visit with a light device setting', () => {
    const theme = TestBed.inject(ThemePreference);
    expect(theme.theme()).toBe('day');
    expect(root().classList.contains(NIGHT_THEME_CLASS)).toBe(false);
  });

  it('starts in the night theme on a first visit when the device prefers dark', () => {
    prefersDark = true;
    expect(TestBed.inject(ThemePreference).theme()).toBe('night');
    expect(root().classList.contains(NIGHT_THEME_CLASS)).toBe(true);
  });

  it('toggles, applies and remembers the choice', () => {
    const theme = TestBed.inject(ThemePreference);
    theme.toggle();
    expect(theme.isNight()).toBe(true);
    expect(root().classList.contains(NIGHT_THEME_CLASS)).toBe(true);
    expect(localStorage.getItem(THEME_STORAGE_KEY)).toBe('night');

    theme.toggle();
    expect(root().classList.contains(NIGHT_THEME_CLASS)).toBe(false);
    expect(localStorage.getItem(THEME_STORAGE_KEY)).toBe('day');
  });

  it('lets the remembered choice win over the device setting', () => {
    prefersDark = true;
    localStorage.setItem(THEME_STORAGE_KEY, 'day');
    expect(TestBed.inject(ThemePreference).theme()).toBe('day');
  });
});
