import type { ComponentType } from '@angular/cdk/portal';
import { DestroyRef, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';

/** How long a passing note stays (it also has a Close button): long enough to read two lines. */
const NOTE_DURATION_MS = 5000;

/**
 * What a list page does with its form dialogs (fleet, people): opens one with the focus on its
 * first field, hands what it saved to the page, and says so in a passing note. Create it with
 * `formDialogs()` in a component's field: a dialog still open when the page goes away no longer
 * calls back.
 */
export class FormDialogs {
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  /** Opens `component` with `data`; `saved` runs with what it closed with, unless cancelled. */
  open<C, D, R>(component: ComponentType<C>, data: D, saved: (result: R) => void): void {
    this.dialog
      .open<C, D, R>(component, { data, autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((result) => {
        if (result) saved(result);
      });
  }

  /** A passing note at the foot of the screen, e.g. "ZZ-KFA is saved.". */
  note(sentence: string): void {
    this.snackBar.open(sentence, 'Close', { duration: NOTE_DURATION_MS });
  }
}

/** The `FormDialogs` of the component being created. */
export function formDialogs(): FormDialogs {
  return new FormDialogs();
}

/** `list` with `saved` in place of the record with its id, or added at the end when new. */
export function withSavedRecord<T extends { readonly id: number }>(list: readonly T[], saved: T): readonly T[] {
  return list.some((item) => item.id === saved.id) ? list.map((item) => (item.id === saved.id ? saved : item)) : [...list, saved];
}
