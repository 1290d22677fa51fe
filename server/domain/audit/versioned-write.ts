import type { Transaction } from 'sequelize';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';

/** The 409 `stale_version` message: "Someone else changed this plan since you opened it. …". */
export const staleMessage = (what = 'this') =>
  `Someone else changed ${what} since you opened it. Reload to see their change, then try again.`;

/**
 * The versioned write every edit makes, inside the caller's transaction:
 * `write` is the repository's conditional update (`updateIfVersion`,
 * `updateIfRowVersion`), which returns null when the row's version is no longer
 * the one the caller last saw; that is a 409 `stale_version` (and the
 * transaction rolls back). Otherwise the audit event (`before` → the written
 * row) is recorded and the written row returned.
 *
 * @example
 * return writeVersioned(actor, t, { entityType: 'site', entityId: id, before }, () =>
 *   sitesRepository.updateIfVersion(actor.organizationId, id, version, changes, t),
 * );
 */
export async function writeVersioned<T>(
  actor: Actor,
  transaction: Transaction,
  audit: { action?: string; entityType: string; entityId: string; before: unknown; stale?: string },
  write: () => Promise<T | null>,
): Promise<T> {
  const after = await write();
  if (!after) throw AppError.conflict(audit.stale ?? staleMessage(), 'stale_version');
  const { action = 'update', entityType, entityId, before } = audit;
  await auditRepository.record(actor, { action, entityType, entityId, before, after }, transaction);
  return after;
}
