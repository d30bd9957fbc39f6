import { Pipe, PipeTransform } from '@angular/core';
import { utcDateTime } from '../core/format/display-format';

/** An API timestamp as "30 Nov 2026, 08:12 UTC": flight operations keep time in UTC (display-format.ts). */
@Pipe({ name: 'utcDate' })
export class UtcDatePipe implements PipeTransform {
  /** `zone` false where a column heading already says UTC. */
  transform(value: string | null | undefined, zone = true): string {
    if (!value) return '—';
    return Number.isFinite(Date.parse(value)) ? utcDateTime(value, { zone }) : '—';
  }
}
