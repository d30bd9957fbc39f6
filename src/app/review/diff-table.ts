import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CANONICAL_UNITS, type StatedUnits } from '@shared/speed-book/stated-units';
import type { RevisionDiff } from '../speed-books/revisions-api';
import { changeLocation, changeValueIn } from './change-location';

const KIND_WORDS = { added: 'Added', removed: 'Removed', changed: 'Changed' } as const;

/** A single figure's words split into the stated figure and the stored one, so each stays whole on screen. */
function figureParts(words: string, value: unknown): { stated: string; stored: string | null } {
  const split = typeof value === 'number' ? /^(.+) \((.+ (?:kt|kg))\)$/.exec(words) : null;
  return split ? { stated: split[1]!, stored: split[2]! } : { stated: words, stored: null };
}

/** The field-by-field changes from the published revision to the one under review. */
@Component({
  selector: 'sw-diff-table',
  imports: [MatIconModule],
  template: `
    @if (rows().length === 0) {
      <p class="same" data-testid="diff-empty"><mat-icon>check</mat-icon>The content is the same as revision {{ againstNumber() }}.</p>
    } @else {
      <p class="count">{{ rows().length }} {{ rows().length === 1 ? 'change' : 'changes' }} from revision {{ againstNumber() }}</p>
      <div class="frame">
        <table aria-label="Changes against the published revision" data-testid="diff-table">
          <thead>
            <tr>
              <th scope="col">Field</th>
              <th scope="col">Rev. {{ againstNumber() }}</th>
              <th scope="col">Rev. {{ revisionNumber() }}</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.path) {
              <tr [class]="row.kind">
                <th scope="row">
                  {{ row.location }}
                  <span class="kind">{{ row.kindWord }}</span>
                  <span class="path sw-mono">{{ row.path }}</span>
                </th>
                <td class="before">
                  {{ row.before.stated }}
                  @if (row.before.stored) {
                    <span class="stored">({{ row.before.stored }})</span>
                  }
                </td>
                <td class="after">
                  {{ row.after.stated }}
                  @if (row.after.stored) {
                    <span class="stored">({{ row.after.stored }})</span>
                  }
                </td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styles: `
    .count,
    .same {
      display: flex;
      gap: 8px;
      align-items: center;
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    .frame {
      overflow-x: auto;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
    }
    table {
      width: 100%;
      border-collapse: collapse;
      font-variant-numeric: tabular-nums;
    }
    th,
    td {
      padding: 8px 10px;
      text-align: left;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    td {
      min-width: 4rem;
      overflow-wrap: anywhere;
    }
    thead th {
      white-space: nowrap;
    }
    .kind {
      display: inline-block;
      margin-left: 6px;
      padding: 0 6px;
      border-radius: 4px;
      font: var(--mat-sys-label-small);
      background: var(--mat-sys-surface-container-high);
    }
    thead th {
      font: var(--mat-sys-label-large);
      background: var(--mat-sys-surface-container);
    }
    tbody th {
      font: var(--mat-sys-body-medium);
      font-weight: 500;
    }
    .path {
      display: block;
      overflow-wrap: anywhere;
      font-size: 0.75rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .stored {
      display: block;
      white-space: nowrap;
      font-weight: 400;
      font-size: 0.8125rem;
    }
    .before {
      text-decoration: line-through;
      text-decoration-color: var(--mat-sys-error);
    }
    .removed .before,
    .added .after,
    .changed .after {
      font-weight: 700;
    }
    .added .after,
    .changed .after {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    .removed .before {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiffTable {
  readonly diff = input.required<RevisionDiff>();
  readonly revisionNumber = input.required<number>();
  readonly againstNumber = input.required<number>();
  /** The flight manual's units of the revision under review: both columns show figures in them, stored kt and kg beside. */
  readonly units = input<StatedUnits>(CANONICAL_UNITS);

  protected readonly rows = computed(() =>
    this.diff().changes.map((change) => ({
      path: change.path,
      kind: change.kind,
      kindWord: KIND_WORDS[change.kind],
      location: changeLocation(change.path, this.units()),
      before: figureParts(changeValueIn(change.path, change.before, this.units()), change.before),
      after: figureParts(changeValueIn(change.path, change.after, this.units()), change.after),
    })),
  );
}
