/**
 * Every date and number the client shows, in one place. Flight operations keep time in UTC,
 * so every timestamp is shown in UTC and says so (or sits under a heading that does). Free of
 * Angular, so device sync (run under Node in tests) uses the same functions as the pages.
 *
 * - `utcDate(iso)`: "30 Nov 2026, 08:12 UTC" — the card's and the lists' form (shared with the
 *   printed card, `shared/card/card-presentation.ts`).
 * - `utcDateTime(iso, { seconds, zone })`: the same with seconds (audit trail, mailbox) or
 *   without " UTC" (where a column heading says it).
 * - `utcMinutes(iso)`: "2026-12-01 09:30 UTC" — ISO 8601 order, for sentences about data age.
 * - `utcMinutesShort(iso)`: "2026-12-01 23:45" — two time columns on a tablet (card log).
 * - `utcDay(iso)`: "2026-12-01".
 * - `cardNumber(value, decimals)`: "1,100" — figures with thousands separators.
 * - `fileSize(bytes)`: "1.2 MB", "340 kB".
 */
import { cardNumber, utcDate } from '@shared/card/card-presentation';

export { cardNumber, utcDate };

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;
const pad = (n: number) => String(n).padStart(2, '0');

function validDate(iso: string): Date | null {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "30 Nov 2026, 08:12 UTC" (`seconds`: "08:12:05"; `zone` false: without " UTC"); `iso` itself when unreadable. */
export function utcDateTime(iso: string, options: { readonly seconds?: boolean; readonly zone?: boolean } = {}): string {
  const date = validDate(iso);
  if (!date) return iso;
  const time = `${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())}${options.seconds ? `:${pad(date.getUTCSeconds())}` : ''}`;
  return `${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}, ${time}${options.zone === false ? '' : ' UTC'}`;
}

/** "2026-12-01 09:30 UTC"; `iso` itself when unreadable. */
export function utcMinutes(iso: string): string {
  const short = utcMinutesShort(iso);
  return short === iso ? iso : `${short} UTC`;
}

/** "2026-12-01 23:45" (UTC, where a heading says so); `iso` itself when unreadable. */
export function utcMinutesShort(iso: string): string {
  const date = validDate(iso);
  return date ? `${date.toISOString().slice(0, 10)} ${date.toISOString().slice(11, 16)}` : iso;
}

/** "2026-12-01" (UTC); `iso` itself when unreadable. */
export function utcDay(iso: string): string {
  const date = validDate(iso);
  return date ? date.toISOString().slice(0, 10) : iso;
}

/** "1.2 MB" from a million bytes up, else whole kilobytes (at least 1 kB): decimal units, as file managers show. */
export function fileSize(bytes: number): string {
  return bytes >= 1_000_000 ? `${(bytes / 1_000_000).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1000))} kB`;
}
