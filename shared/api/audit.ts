/** The audit trail as `GET /api/audit` serves it: newest first, filtered, a page at a time. */
import * as z from 'zod';

const numericId = (what: string) => z.string().regex(/^[1-9]\d{0,19}$/, `${what} is a record id (digits).`);

export const auditQuerySchema = z.strictObject({
  entityType: z.string().max(64).optional(),
  entityId: z.string().max(64).optional(),
  actorId: numericId('actorId').optional(),
  action: z.string().max(64).optional(),
  from: z.iso.datetime({ offset: true, error: 'from is an ISO 8601 date and time, such as 2026-12-01T00:00:00Z.' }).optional(),
  to: z.iso.datetime({ offset: true, error: 'to is an ISO 8601 date and time, such as 2026-12-01T00:00:00Z.' }).optional(),
  limit: z.coerce.number({ error: 'limit is a number from 1 to 200.' }).int('limit is a whole number.').min(1, 'limit is at least 1.').max(200, 'limit is at most 200.').default(50),
  /** `nextCursor` of the previous page. */
  cursor: numericId('cursor').optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const auditEventSchema = z.object({
  id: z.number().int().positive(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string().nullable(),
  actorId: z.number().int().positive().nullable(),
  actorName: z.string().nullable(),
  details: z.record(z.string(), z.unknown()).nullable(),
  ip: z.string().nullable(),
  userAgent: z.string().nullable(),
  createdAt: z.string(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({
  events: z.array(auditEventSchema),
  /** Pass as `cursor` for the next (older) page; null on the last page. */
  nextCursor: z.string().nullable(),
});

/**
 * The user agent the audit trail records for changes made with the server's command line
 * (`npm run operator:create`): no person was signed in, and no address asked.
 */
export const COMMAND_LINE_USER_AGENT = 'speedwright-cli';
