import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, FormGroup } from '@angular/forms';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { forkJoin, switchMap } from 'rxjs';
import type { AircraftTypeView } from '@shared/api/fleet';
import { createSpeedBookSchema, type SpeedBookSummary } from '@shared/api/revisions';
import { userMay } from '../core/auth/user-may';
import { requestState } from '../core/api/request-state';
import { FORM_PAGE_IMPORTS } from '../core/forms/form-page-imports';
import { zodValidator } from '../core/forms/zod-validator';
import { RevisionsApi } from './revisions-api';
import { UtcDatePipe } from './utc-date-pipe';
import { ProblemRetry } from '../core/feedback/problem-retry';

/** The operator's speed books with their current published revision; engineers add one per type. */
@Component({
  selector: 'sw-speed-book-list',
  imports: [ProblemRetry, FORM_PAGE_IMPORTS, MatSelectModule, UtcDatePipe],
  templateUrl: './speed-book-list.html',
  styleUrl: './speed-books.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedBookList {
  private readonly api = inject(RevisionsApi);
  private readonly router = inject(Router);

  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly books = signal<readonly SpeedBookSummary[]>([]);
  protected readonly types = signal<readonly AircraftTypeView[]>([]);
  protected readonly mayEdit = userMay('edit-speed-books');
  /** A type has at most one speed book, so only types without one can get a new one. */
  protected readonly typesWithoutBook = computed(() => this.types().filter((type) => !this.books().some((book) => book.aircraftTypeId === type.id)));
  private readonly creation = requestState();
  protected readonly creating = this.creation.busy;
  protected readonly createProblem = this.creation.problem;
  protected readonly newBook = new FormGroup({
    aircraftTypeId: new FormControl<number | null>(null, zodValidator(createSpeedBookSchema.shape.aircraftTypeId)),
    title: new FormControl('', { nonNullable: true, validators: zodValidator(createSpeedBookSchema.shape.title) }),
  });

  constructor() {
    this.loadSpeedBooks();
  }

  protected typeName(aircraftTypeId: number): string {
    const type = this.types().find((t) => t.id === aircraftTypeId);
    return type ? `${type.designator} · ${type.name}` : `Type ${aircraftTypeId}`;
  }

  protected loadSpeedBooks(): void {
    this.request.run(forkJoin({ books: this.api.speedBooks(), types: this.api.aircraftTypes() }), ({ books, types }) => {
      this.books.set(books);
      this.types.set(types);
    });
  }

  protected suggestTitle(): void {
    const type = this.types().find((t) => t.id === this.newBook.controls.aircraftTypeId.value);
    if (type && !this.newBook.controls.title.dirty) this.newBook.controls.title.setValue(`${type.name} speed book`);
  }

  protected createSpeedBook(): void {
    this.newBook.markAllAsTouched();
    if (this.newBook.invalid || this.creating()) return;
    const { aircraftTypeId, title } = this.newBook.getRawValue();
    // Busy until the new book's page is open, so the button cannot create it twice meanwhile.
    this.creation.run(
      this.api
        .createSpeedBook({ aircraftTypeId: aircraftTypeId!, title: title.trim() })
        .pipe(switchMap((book) => this.router.navigate(['/speed-books'], { queryParams: { book: book.id } }))),
      () => undefined,
      (error) => error.fields['aircraftTypeId'] ?? error.fields['title'] ?? error.message,
    );
  }
}
