import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models';
import type { RequestOrigin } from './actor';

export interface AuditInput {
  operatorId: number;
  /** The signed-in person; null when nobody is (e.g. a password reset asked for by e-mail). */
  actorId: number | null;
  /** A verb phrase in kebab-case: `revision.approved`, `user.invited`, `airframe.updated`. */
  action: string;
  /** `revision`, `speed-book`, `airframe`, `user`, … */
  entityType: string;
  entityId: number | string | null;
  /** Anything that explains the change (before/after, a reason); stored as JSON. */
  details?: Record<string, unknown>;
  /** The address and user agent the change came from (none for the demo seed). */
  origin?: RequestOrigin;
}

/**
 * Appends one audit event. Pass the transaction of the change it records, so the change and
 * its audit line are written together or not at all.
 */
export async function recordAudit(input: AuditInput, transaction?: Transaction): Promise<AuditEvent> {
  const userAgent = input.origin?.userAgent;
  return AuditEvent.create(
    {
      operatorId: input.operatorId,
      actorId: input.actorId,
      action: input.action,
      entityType: input.entityType,
      entityId: input.entityId === null ? null : String(input.entityId),
      details: input.details === undefined ? null : JSON.stringify(input.details),
      ip: input.origin?.ip ?? null,
      userAgent: userAgent ? userAgent.slice(0, 500) : null,
      createdAt: new Date(),
    },
    { transaction },
  );
}
