import type { Transaction } from 'sequelize';
import type { Actor } from '@/server/domain/actor';
import { AuditEventModel } from '../models';

export interface AuditEntry {
  action: 'create' | 'update' | 'delete' | string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
}

export const auditRepository = {
  /** Records one write inside the caller's transaction, so it lands or fails with it. */
  async record(actor: Actor, entry: AuditEntry, transaction: Transaction): Promise<void> {
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
};
