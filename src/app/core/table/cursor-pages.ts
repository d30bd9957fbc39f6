import { computed, signal } from '@angular/core';

/**
 * Where a reader stands in a log the server pages with cursors (audit trail, card log),
 * newest first: the cursor of the page shown, the one of the next older page the server
 * named, and the cursors of the newer pages behind, so that "Newer" goes back exactly.
 * `load` asks for the page at a cursor (null: the newest) and calls `arrived` with the
 * server's answer.
 */
export class CursorPages {
  /** Cursors of the pages before this one; the first page has none. */
  private readonly newerCursors = signal<readonly (string | null)[]>([]);
  private readonly currentCursor = signal<string | null>(null);
  private readonly olderCursor = signal<string | null>(null);
  readonly pageNumber = computed(() => this.newerCursors().length + 1);
  readonly hasNewer = computed(() => this.newerCursors().length > 0);
  readonly hasOlder = computed(() => this.olderCursor() !== null);

  constructor(private readonly load: (cursor: string | null) => void) {}

  /** The newest page, forgetting the way back (after the filter changed). */
  first(): void {
    this.newerCursors.set([]);
    this.load(null);
  }

  older(): void {
    const next = this.olderCursor();
    if (next === null) return;
    this.newerCursors.update((list) => [...list, this.currentCursor()]);
    this.load(next);
  }

  newer(): void {
    const list = this.newerCursors();
    if (list.length === 0) return;
    this.newerCursors.set(list.slice(0, -1));
    this.load(list[list.length - 1]);
  }

  /** The page shown, again. */
  reload(): void {
    this.load(this.currentCursor());
  }

  /** The page at `cursor` arrived; the server names the next older one (null: none). */
  arrived(cursor: string | null, nextCursor: string | null): void {
    this.currentCursor.set(cursor);
    this.olderCursor.set(nextCursor);
  }
}
