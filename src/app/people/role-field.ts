import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { map, startWith, switchMap } from 'rxjs';
import { ROLES, ROLE_LABELS, ROLE_SUMMARIES, type Role } from '@shared/auth/roles';

/**
 * The role of a person being invited or changed: the roles by their labels, and under the field
 * what the chosen role may do (shared/auth/roles.ts), so an administrator chooses knowingly.
 */
@Component({
  selector: 'sw-role-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>Role</mat-label>
      <mat-select [formControl]="control()" required>
        @for (option of roles; track option.role) {
          <mat-option [value]="option.role">{{ option.label }}</mat-option>
        }
      </mat-select>
      @if (summary(); as summary) {
        <mat-hint>{{ summary }}</mat-hint>
      }
      @if (message(); as text) {
        <mat-error>{{ text }}</mat-error>
      }
    </mat-form-field>
  `,
  styles: `
    :host,
    mat-form-field {
      display: block;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoleField {
  readonly control = input.required<FormControl<Role | null>>();
  /** The sentence under the field (the form's or the server's), or null. */
  readonly message = input<string | null>(null);

  protected readonly roles = ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }));
  protected readonly summary = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) => control.valueChanges.pipe(startWith(control.value))),
      map((role) => (role ? ROLE_SUMMARIES[role] : null)),
    ),
    { initialValue: null },
  );
}
