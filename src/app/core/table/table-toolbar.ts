import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

/**
 * The toolbar above a list table: the filter box, the count sentence (announced politely as
 * it changes) and whatever the page projects beside them (an "Invite" button).
 */
@Component({
  selector: 'sw-table-toolbar',
  imports: [MatFormFieldModule, MatInputModule, MatIconModule],
  templateUrl: './table-toolbar.html',
  styleUrl: './list-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TableToolbar {
  readonly filterLabel = input.required<string>();
  readonly filterHint = input.required<string>();
  readonly filterText = input.required<string>();
  /** The count sentence; null hides it (while loading). */
  readonly count = input.required<string | null>();
  readonly countTestId = input.required<string>();
  readonly filterChange = output<string>();

  protected filterTyped(event: Event): void {
    this.filterChange.emit((event.target as HTMLInputElement).value);
  }
}
