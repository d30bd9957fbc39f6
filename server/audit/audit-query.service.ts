import { Op, type WhereOptions } from 'sequelize';
import type { AuditEventView, AuditQuery } from '@shared/api/audit';
import { AuditEvent, User } from '../models';

/** One page of the operator's audit trail, newest first; `nextCursor` continues with older events. */
export async function listAudit(operatorId: number, query: AuditQuery): Promise<{ events: AuditEventView[]; nextCursor: string | null }> {
  const where: WhereOptions<AuditEvent> = { operatorId };
  const and: WhereOptions<AuditEvent>[] = [];
  if (query.entityType) and.push({ entityType: query.entityType });
  if (query.entityId) and.push({ entityId: query.entityId });
  if (query.actorId) and.push({ actorId: Number(query.actorId) });
  if (query.action) and.push({ action: query.action });
  if (query.from) and.push({ createdAt: { [Op.gte]: new Date(query.from) } });
  if (query.to) and.push({ createdAt: { [Op.lte]: new Date(query.to) } });
  if (query.cursor) and.push({ id: { [Op.lt]: Number(query.cursor) } });
  const rows = await AuditEvent.findAll({
    where: and.length ? { ...where, [Op.and]: and } : where,
    order: [['id', 'DESC']],
    limit: query.limit + 1,
  });
  const page = rows.slice(0, query.limit);
  const actorIds = [...new Set(page.map((event) => event.actorId).filter((id): id is number => id !== null))];
  const people = actorIds.length ? await User.findAll({ where: { id: actorIds, operatorId }, attributes: ['id', 'displayName'] }) : [];
  const names = new Map(people.map((person) => [person.id, person.displayName]));
  return {
    events: page.map((event) => ({
      id: event.id,
      action: event.action,
      entityType: event.entityType,
      entityId: event.entityId,
      actorId: event.actorId,
      actorName: event.actorId === null ? null : (names.get(event.actorId) ?? null),
      details: event.detailsObject(),
      ip: event.ip,
      userAgent: event.userAgent,
      createdAt: event.createdAt.toISOString(),
    })),
    nextCursor: rows.length > query.limit ? String(page[page.length - 1].id) : null,
  };
}
