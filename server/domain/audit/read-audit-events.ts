import type { AuditEventQuery } from '@/shared/schemas/audit';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';

/**
 * The organisation's audit trail for administrators and reviewers. Asking for
 * one record's history answers 404 when the organisation has none for it (a
 * record of another organisation is not found, as everywhere else).
 */
export async function readAuditEvents(actor: Actor, query: AuditEventQuery) {
  if (query.entityId && !(await auditRepository.hasEntity(actor.organizationId, query.entityId))) {
    throw AppError.notFound('That record’s history');
  }
  return auditRepository.page(actor.organizationId, query);
}
