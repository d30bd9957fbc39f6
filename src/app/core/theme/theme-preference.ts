import { MediaMatcher } from '@angular/cdk/layout';
import { DOCUMENT } from '@angular/common';
import { Injectable, computed, inject, signal } from '@angular/core';

export type ThemeName = 'day' | 'night';

export const THEME_STORAGE_KEY = 'speedwright.theme';
/** The class on <html> that switches styles.scss to the night palette. */
export const NIGHT_THEME_CLASS = 'theme-night';

/** Browser chrome colour per theme, matching the toolbar so the night theme has no bright bar. */
const THEME_COLORS: Readonly<Record<ThemeName, string>> = { day: '#1f5f6f', night: '#0a0f11' };

/**
 * Day or night theme. The person's last choice wins; on a first visit the device's
 * light/dark setting decides.
 */
@Injectable({ providedIn: 'root' })
export class ThemePreference {
  private readonly document = inject(DOCUMENT);
  private readonly mediaMatcher = inject(MediaMatcher);
  private readonly current = signal<ThemeName>(this.initialTheme());

  readonly theme = this.current.asReadonly();
  readonly isNight = computed(() => this.current() === 'night');

  constructor() {
    this.apply(this.current());
  }

  toggle(): void {
    this.choose(this.isNight() ? 'day' : 'night');
  }

  choose(theme: ThemeName): void {
    this.current.set(theme);
    this.apply(theme);
    this.remember(theme);
  }

  private initialTheme(): ThemeName {
    const stored = this.storage()?.getItem(THEME_STORAGE_KEY);
    if (stored === 'day' || stored === 'night') {
      return stored;
    }
    return this.mediaMatcher.matchMedia('(prefers-color-scheme: dark)').matches ? 'night' : 'day';
  }

  private apply(theme: ThemeName): void {
    this.document.documentElement.classList.toggle(NIGHT_THEME_CLASS, theme === 'night');
    this.document.querySelector('meta[name="theme-color"]')?.setAttribute('content', THEME_COLORS[theme]);
  }

  private remember(theme: ThemeName): void {
    try {
      this.storage()?.setItem(THEME_STORAGE_KEY, theme);
    } catch {
      // Storage full or blocked: the theme still applies for this visit.
    }
  }

  private storage(): Storage | null {
    try {
      return this.document.defaultView?.localStorage ?? null;
    } catch {
      return null;
    }
  }
}
