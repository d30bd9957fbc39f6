import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup } from '@angular/forms';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { forkJoin } from 'rxjs';
import type { AircraftTypeView } from '@shared/api/fleet';
import { createSpeedBookSchema, type SpeedBookSummary } from '@shared/api/revisions';
import { ApiRequestError } from '../core/api/api-request-error';
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
  private readonly destroyRef = inject(DestroyRef);

  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly books = signal<readonly SpeedBookSummary[]>([]);
  protected readonly types = signal<readonly AircraftTypeView[]>([]);
  protected readonly mayEdit = userMay('edit-speed-books');
  /** A type has at most one speed book, so only types without one can get a new one. */
  protected readonly typesWithoutBook = computed(() => this.types().filter((type) => !this.books().some((book) => book.aircraftTypeId === type.id)));
  protected readonly creating = signal(false);
  protected readonly createProblem = signal<string | null>(null);
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
    if (this.newBook.invalid) return;
    const { aircraftTypeId, title } = this.newBook.getRawValue();
    this.creating.set(true);
    this.createProblem.set(null);
    this.api
      .createSpeedBook({ aircraftTypeId: aircraftTypeId!, title: title.trim() })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (book) => void this.router.navigate(['/speed-books'], { queryParams: { book: book.id } }),
        error: (error: ApiRequestError) => {
          this.creating.set(false);
          this.createProblem.set(error.fields['aircraftTypeId'] ?? error.fields['title'] ?? error.message);
        },
      });
  }
}
