import { formatDate } from '@angular/common';
import { Pipe, PipeTransform } from '@angular/core';

/** An API timestamp as "30 Nov 2026, 08:12 UTC": flight operations keep time in UTC. */
@Pipe({ name: 'utcDate' })
export class UtcDatePipe implements PipeTransform {
  transform(value: string | null | undefined, empty = '—'): string {
    if (!value) return empty;
    const ms = Date.parse(value);
    return Number.isFinite(ms) ? `${formatDate(ms, 'd MMM y, HH:mm', 'en-US', 'UTC')} UTC` : empty;
  }
}
