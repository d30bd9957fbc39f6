import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, model } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { controlMessage } from '../core/forms/server-field-errors';

/**
 * The new password typed twice, as every password page asks it: "New password" with the rule
 * as its hint and the show/hide button (which shows every password field of the page, so it
 * is two-way: `[(visible)]`), then "New password again". The fields are controls of `form`
 * named `passwordName` and `repeatName`; build the repeat's validator with `sameAs`. The repeat
 * is checked again whenever the password changes.
 */
@Component({
  selector: 'sw-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>New password</mat-label>
      <input matInput [formControl]="password()" [type]="visible() ? 'text' : 'password'" autocomplete="new-password" required />
      <button mat-icon-button matSuffix type="button" [attr.aria-label]="visible() ? 'Hide passwords' : 'Show passwords'" (click)="toggle()">
        <mat-icon>{{ visible() ? 'visibility_off' : 'visibility' }}</mat-icon>
      </button>
      <mat-hint>At least 12 characters, not a common password; a few unrelated words work well</mat-hint>
      @if (message(passwordName()); as text) {
        <mat-error>{{ text }}</mat-error>
      }
    </mat-form-field>

    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>New password again</mat-label>
      <input matInput [formControl]="repeat()" [type]="visible() ? 'text' : 'password'" autocomplete="new-password" required />
      @if (message(repeatName()); as text) {
        <mat-error>{{ text }}</mat-error>
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields implements OnInit {
  private readonly destroyRef = inject(DestroyRef);
  readonly form = input.required<FormGroup>();
  readonly passwordName = input.required<string>();
  readonly repeatName = input.required<string>();
  /** Whether the passwords show as text. */
  readonly visible = model(false);

  protected readonly password = computed(() => this.form().get(this.passwordName()) as FormControl<string>);
  protected readonly repeat = computed(() => this.form().get(this.repeatName()) as FormControl<string>);
  protected readonly message = (path: string) => controlMessage(this.form(), path);

  ngOnInit(): void {
    this.password()
      .valueChanges.pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.repeat().updateValueAndValidity({ emitEvent: false }));
  }

  protected toggle(): void {
    this.visible.update((visible) => !visible);
  }
}

/**
 * The repeat field's rule: present, and the same as the sibling control `passwordName`.
 * `noun` names the password in the sentences ("new password", "password").
 */
export function sameAs(passwordName: string, noun: string): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const password = control.parent?.get(passwordName)?.value as string | undefined;
    if (!control.value) return { schema: `Type the ${noun} a second time.` };
    return control.value === password ? null : { schema: `The two ${noun}s are not the same.` };
  };
}
