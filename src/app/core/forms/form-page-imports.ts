import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

/**
 * The building blocks of a page that loads a record and acts on it through a form (speed books,
 * review, editor): reactive forms, links, buttons, text fields, icons and the loading bar. Put it
 * in a component's `imports` (Angular flattens nested arrays there) beside the page's own pieces.
 */
export const FORM_PAGE_IMPORTS = [
  ReactiveFormsModule,
  RouterLink,
  MatButtonModule,
  MatFormFieldModule,
  MatIconModule,
  MatInputModule,
  MatProgressBarModule,
] as const;
