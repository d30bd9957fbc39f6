import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { ThemePreference } from '../core/theme/theme-preference';

/** Switches between the day theme and the dimmed night theme for a dark cockpit. */
@Component({
  selector: 'sw-theme-toggle',
  imports: [MatIcon],
  template: `
    <button
      class="sw-icon-button"
      type="button"
      aria-label="Night theme"
      [attr.aria-pressed]="isNight()"
      [attr.title]="isNight() ? 'Night theme is on' : 'Night theme is off'"
      (click)="toggleTheme()"
    >
      <mat-icon>{{ isNight() ? 'dark_mode' : 'light_mode' }}</mat-icon>
    </button>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThemeToggle {
  private readonly preference = inject(ThemePreference);

  protected readonly isNight = this.preference.isNight;

  protected toggleTheme(): void {
    this.preference.toggle();
  }
}
