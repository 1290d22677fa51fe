import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { auditChanges } from '@/shared/audit/audit-changes';
import type { AuditEvent, AuditEventQuery } from '@/shared/schemas/audit';
import { AuditEventModel, UserModel } from '../models';

/** The record's name or title as recorded, if it had one. */
function nameIn(summary: { before?: unknown; after?: unknown }): string | null {
  for (const side of [summary.after, summary.before]) {
    if (side && typeof side === 'object') {
      const r = side as Record<string, unknown>;
      if (typeof r.name === 'string') return r.name;
      if (typeof r.title === 'string') return r.title;
    }
  }
  return null;
}

export interface AuditEntry {
  action: 'create' | 'update' | 'delete' | string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
}

export const auditRepository = {
  /** Records one write inside the caller's transaction, so it lands or fails with it. */
  async record(actor: { userId: string; organizationId: string }, entry: AuditEntry, transaction: Transaction): Promise<void> {
    await AuditEventModel.create(
      {
        organizationId: actor.organizationId,
        actorId: actor.userId,
        action: entry.action,
        entityType: entry.entityType,
        entityId: entry.entityId,
        summary: { before: entry.before, after: entry.after },
      },
      { transaction },
    );
  },

  async forEntity(organizationId: string, entityType: string, entityId: string) {
    const rows = await AuditEventModel.findAll({
      where: { organizationId, entityType, entityId },
      order: [['id', 'ASC']],
      raw: true,
    });
    return rows.map((r) => ({
      action: r.action,
      actorId: r.actorId,
      summary: r.summary,
      at: new Date(r.createdAt).toISOString(),
    }));
  },

  /** Whether the organisation's trail has any event about this record. */
  async hasEntity(organizationId: string, entityId: string): Promise<boolean> {
    return (await AuditEventModel.count({ where: { organizationId, entityId } })) > 0;
  },

  /** One page of the organisation's trail, newest first, filtered; changes worked out field by field. */
  async page(
    organizationId: string,
    query: AuditEventQuery,
  ): Promise<{ items: AuditEvent[]; total: number; page: number; pageSize: number }> {
    const at: Record<symbol, Date> = {};
    if (query.from) at[Op.gte] = new Date(query.from);
    if (query.to) at[Op.lt] = new Date(query.to);
    const where: WhereOptions = {
      organizationId,
      ...(query.entityType && { entityType: query.entityType }),
      ...(query.entityId && { entityId: query.entityId }),
      ...(query.actorId && { actorId: query.actorId }),
      ...((query.from || query.to) && { createdAt: at }),
    };
    const { rows, count } = await AuditEventModel.findAndCountAll({
      where,
      order: [['id', 'DESC']],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
      raw: true,
    });
    const actorIds = [...new Set(rows.map((r) => r.actorId).filter((id): id is string => !!id))];
    const people = actorIds.length
      ? await UserModel.findAll({ where: { id: actorIds }, attributes: ['id', 'name'], raw: true })
      : [];
    const nameOf = new Map(people.map((p) => [p.id, p.name]));
    const items = rows.map((r): AuditEvent => ({
      id: String(r.id),
      action: r.action,
      entityType: r.entityType,
      entityId: r.entityId,
      entityName: nameIn(r.summary),
      actor: r.actorId ? { id: r.actorId, name: nameOf.get(r.actorId) ?? 'former user' } : null,
      at: new Date(r.createdAt).toISOString(),
      changes: auditChanges(r.summary.before, r.summary.after),
    }));
    return { items, total: count, page: query.page, pageSize: query.pageSize };
  },
};
