import { utcDateTime } from '../core/format/display-format';
import { AuditEventView, COMMAND_LINE_USER_AGENT } from '@shared/api/audit';
import { actionLabel, entityLabel } from './audit-vocabulary';

/** One line of a record's details: a field and what happened to it. */
export interface AuditDetail {
  readonly name: string;
  readonly value: string;
}

/** An audit event as the audit table shows it. */
export interface AuditRow {
  readonly id: number;
  readonly whenLabel: string;
  readonly personLabel: string;
  readonly actionLabel: string;
  readonly recordLabel: string;
  readonly details: readonly AuditDetail[];
  readonly ip: string | null;
  readonly userAgent: string | null;
}

/** Times in UTC, as flight operations keep them. */
export function toAuditRow(event: AuditEventView): AuditRow {
  const when = Date.parse(event.createdAt);
  return {
    id: event.id,
    whenLabel: Number.isFinite(when) ? utcDateTime(event.createdAt, { seconds: true }) : event.createdAt,
    personLabel: event.actorName ?? (event.actorId === null ? nobodyLabel(event) : `Person #${event.actorId}`),
    actionLabel: actionLabel(event.action),
    recordLabel: event.entityId === null ? entityLabel(event.entityType) : `${entityLabel(event.entityType)} #${event.entityId}`,
    details: Object.entries(event.details ?? {}).map(([name, value]) => ({ name: inWords(name), value: describe(value) })),
    ip: event.ip,
    userAgent: event.userAgent,
  };
}

/** Who acted when nobody was signed in: the server's command line says so; anything else had no one. */
function nobodyLabel(event: AuditEventView): string {
  return event.userAgent?.startsWith(COMMAND_LINE_USER_AGENT) ? 'Command line on the server' : 'Nobody signed in';
}

/** A change recorded as `{ before, after }` reads "before → after"; anything else as compact JSON. */
function describe(value: unknown): string {
  if (isChange(value)) return `${describe(value.before)} → ${describe(value.after)}`;
  if (value === null || value === undefined || (Array.isArray(value) && value.length === 0)) return 'none';
  if (Array.isArray(value) && value.every((item) => typeof item !== 'object')) return value.join(', ');
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

function isChange(value: unknown): value is { before: unknown; after: unknown } {
  return typeof value === 'object' && value !== null && 'before' in value && 'after' in value && Object.keys(value).length === 2;
}

/** `supersededRevisionIds` → "Superseded revision ids". */
function inWords(name: string): string {
  const words = name.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}
