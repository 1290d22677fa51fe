import type { IncidentDetail } from '@/shared/schemas/incident';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import type { Actor } from '@/server/domain/actor';

/** Where the incident's site's posts stand, by id (removed posts keep their place in the log but are not drawn). */
export async function reportingPostsOf(actor: Actor, detail: IncidentDetail) {
  const posts = await postsRepository.listInSite(actor.organizationId, detail.incident.siteId);
  return new Map(posts.map((p) => [p.id, p.location]));
}
