import { formatDate } from '@angular/common';
import { Pipe, PipeTransform } from '@angular/core';

/** An API timestamp as "30 Nov 2026, 08:12 UTC": flight operations keep time in UTC. */
@Pipe({ name: 'utcDate' })
export class UtcDatePipe implements PipeTransform {
  /** `zone` false where a column heading already says UTC. */
  transform(value: string | null | undefined, zone = true): string {
    if (!value) return '—';
    const ms = Date.parse(value);
    return Number.isFinite(ms) ? `${formatDate(ms, 'd MMM y, HH:mm', 'en-US', 'UTC')}${zone ? ' UTC' : ''}` : '—';
  }
}
