import type { VisibilityIndex, VisibilityIndexQuery } from '@/shared/schemas/visibility-index';
import { VISIBILITY_INDEX_RAYS } from '@/shared/terrain/visibility-index';
import { visibilityIndexRepository } from '@/server/data/repositories/visibility-index-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import type { VisibilityIndexQueue } from '@/server/domain/ports/visibility-index-queue';
import { activeTerrain } from '@/server/domain/terrain/active-terrain';
import { toVisibilityIndex } from './visibility-index-view';

/** Unique violation in PostgreSQL: another request created the same layer first. */
const isUniqueViolation = (error: unknown) =>
  (error as { name?: string }).name === 'SequelizeUniqueConstraintError' ||
  (error as { parent?: { code?: string } }).parent?.code === '23505';

/**
 * The visibility index of a site's active terrain for a tower height and a
 * radius: the stored layer when one exists (done, or still being computed),
 * else a new one queued for a worker. `ready` is true once it is done.
 */
export async function requestVisibilityIndex(
  deps: { queue: VisibilityIndexQueue | null },
  actor: Actor,
  siteId: string,
  query: VisibilityIndexQuery,
): Promise<{ ready: boolean; index: VisibilityIndex }> {
  const { site, terrain } = await activeTerrain(actor, siteId);
  const live = await visibilityIndexRepository.findLive(actor.organizationId, terrain.id, query.heightM, query.radiusM);
  if (live) return { ready: live.status === 'done', index: toVisibilityIndex(live) };
  if (!deps.queue) throw new AppError(503, 'queue_unavailable', 'Visibility indexes cannot be computed on this server.');

  let created;
  try {
    created = await visibilityIndexRepository.create({
      organizationId: actor.organizationId,
      siteId: site.id,
      terrainId: terrain.id,
      heightM: query.heightM,
      radiusM: query.radiusM,
      rays: VISIBILITY_INDEX_RAYS,
      requestedById: actor.userId,
    });
  } catch (error) {
    if (!isUniqueViolation(error)) throw error;
    const other = await visibilityIndexRepository.findLive(actor.organizationId, terrain.id, query.heightM, query.radiusM);
    if (!other) throw error;
    return { ready: other.status === 'done', index: toVisibilityIndex(other) };
  }
  try {
    await visibilityIndexRepository.setJob(created.id, await deps.queue.enqueue(created.id));
  } catch (error) {
    await visibilityIndexRepository.fail(created.id, 'The job queue did not accept the layer.');
    throw error;
  }
  const now = await visibilityIndexRepository.findById(created.id);
  return { ready: now?.status === 'done', index: toVisibilityIndex(now ?? created) };
}
