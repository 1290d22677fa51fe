import type { Post, PostInput, PostListQuery, Site, SiteInput } from '@/shared/schemas/site';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { checkPatrol, type PatrolFields } from '@/shared/patrol/check-patrol';
import { staleMessage, writeVersioned } from '@/server/domain/audit/versioned-write';

const STALE = staleMessage();

/**
 * 422 `invalid_patrol` with the fields at fault when a post's route, speed,
 * cycle and kind do not fit together (`checkPatrol`); checked on the post as
 * it would be stored, so a change to one field is judged with the others.
 */
function refuseBadPatrol(post: PatrolFields): void {
  const fields = checkPatrol(post);
  const first = Object.values(fields)[0];
  if (first !== undefined) throw new AppError(422, 'invalid_patrol', first, fields);
}

/** The organisation's sites, a page at a time. */
export function listSites(actor: Actor, page: number, pageSize: number) {
  return sitesRepository.pageInOrganization(actor.organizationId, page, pageSize);
}

export async function getSite(actor: Actor, id: string): Promise<Site> {
  const site = await sitesRepository.findInOrganization(actor.organizationId, id);
  if (!site) throw AppError.notFound('That site');
  return site;
}

export function createSite({ db }: UseCaseDeps, actor: Actor, input: SiteInput): Promise<Site> {
  return db.transaction(async (t) => {
    const site = await sitesRepository.create(actor.organizationId, input, t);
    await auditRepository.record(actor, { action: 'create', entityType: 'site', entityId: site.id, after: site }, t);
    return site;
  });
}

export function updateSite(
  { db }: UseCaseDeps,
  actor: Actor,
  id: string,
  input: Partial<SiteInput> & { version: number },
): Promise<Site> {
  return db.transaction(async (t) => {
    const before = await sitesRepository.findInOrganization(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That site');
    const { version, ...changes } = input;
    return writeVersioned(actor, t, { entityType: 'site', entityId: id, before, stale: STALE }, () =>
      sitesRepository.updateIfVersion(actor.organizationId, id, version, changes, t),
    );
  });
}

/** Soft delete: the site leaves the lists, its history stays. A site with an approved plan is kept. */
export function deleteSite({ db }: UseCaseDeps, actor: Actor, id: string): Promise<void> {
  return db.transaction(async (t) => {
    const before = await sitesRepository.findInOrganization(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That site');
    const approved = await plansRepository.countInSite(id, ['approved'], t);
    if (approved > 0) {
      throw AppError.conflict(
        `This site has ${approved === 1 ? 'an approved plan' : `${approved} approved plans`} that lookouts work to, so it cannot be deleted.`,
        'site_has_approved_plans',
      );
    }
    await sitesRepository.softDelete(actor.organizationId, id, t);
    await auditRepository.record(actor, { action: 'delete', entityType: 'site', entityId: id, before }, t);
  });
}

export async function listPosts(actor: Actor, siteId: string, query: PostListQuery) {
  await getSite(actor, siteId);
  return postsRepository.pageInSite(actor.organizationId, siteId, query);
}

export async function getPost(actor: Actor, siteId: string, id: string): Promise<Post> {
  const post = await postsRepository.findInSite(actor.organizationId, siteId, id);
  if (!post) throw AppError.notFound('That post');
  return post;
}

export function createPost({ db }: UseCaseDeps, actor: Actor, siteId: string, input: PostInput): Promise<Post> {
  return db.transaction(async (t) => {
    if (!(await sitesRepository.findInOrganization(actor.organizationId, siteId, t))) throw AppError.notFound('That site');
    refuseBadPatrol(input);
    const post = await postsRepository.create(actor.organizationId, siteId, input, t);
    await auditRepository.record(actor, { action: 'create', entityType: 'post', entityId: post.id, after: post }, t);
    return post;
  });
}

export function updatePost(
  { db }: UseCaseDeps,
  actor: Actor,
  siteId: string,
  id: string,
  input: Partial<PostInput> & { version: number },
): Promise<Post> {
  return db.transaction(async (t) => {
    const before = await postsRepository.findInSite(actor.organizationId, siteId, id, t);
    if (!before) throw AppError.notFound('That post');
    const { version, ...changes } = input;
    refuseBadPatrol({ ...before, ...changes });
    return writeVersioned(actor, t, { entityType: 'post', entityId: id, before, stale: STALE }, () =>
      postsRepository.updateIfVersion(actor.organizationId, siteId, id, version, changes, t),
    );
  });
}

/** Soft delete: the post leaves the lists, its history stays. A post in a submitted or approved plan is kept. */
export function deletePost({ db }: UseCaseDeps, actor: Actor, siteId: string, id: string): Promise<void> {
  return db.transaction(async (t) => {
    const before = await postsRepository.findInSite(actor.organizationId, siteId, id, t);
    if (!before) throw AppError.notFound('That post');
    const frozen = await plansRepository.withPost(actor.organizationId, id, ['submitted', 'approved'], t);
    if (frozen.length > 0) {
      const named = frozen.map((p) => `“${p.title}” (${p.status})`).join(', ');
      throw AppError.conflict(
        `This post is used by ${frozen.length === 1 ? 'a plan' : `${frozen.length} plans`} that ${frozen.length === 1 ? 'is' : 'are'} submitted or approved — ${named} — so it cannot be deleted: a submitted or approved plan keeps the posts it was built on.`,
        'post_in_frozen_plan',
      );
    }
    await postsRepository.softDelete(actor.organizationId, siteId, id, t);
    await auditRepository.record(actor, { action: 'delete', entityType: 'post', entityId: id, before }, t);
  });
}

/** The name of a copy: “Name (copy)”, or “Name (copy 2)”, “(copy 3)” … when that is taken; at most 120 characters. */
export function copyName(name: string, taken: ReadonlySet<string>): string {
  const base = name.replace(/ \(copy(?: \d+)?\)$/, '');
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? ' (copy)' : ` (copy ${n})`;
    const candidate = `${base.slice(0, 120 - suffix.length).trimEnd()}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/**
 * A new post with the same settings as another of the site (kind, place,
 * heights, sector, status), named “… (copy)”; its photos and watches stay
 * with the original. Audited as a create that names the original.
 */
export function duplicatePost({ db }: UseCaseDeps, actor: Actor, siteId: string, id: string): Promise<Post> {
  return db.transaction(async (t) => {
    const original = await postsRepository.findInSite(actor.organizationId, siteId, id, t);
    if (!original) throw AppError.notFound('That post');
    const taken = new Set((await postsRepository.listInSite(actor.organizationId, siteId, t)).map((p) => p.name));
    const { name, kind, location, groundElevationM, structureHeightM, eyeHeightM, sector, status } = original;
    const { route, speedMps, cycleMinutes } = original;
    const post = await postsRepository.create(
      actor.organizationId,
      siteId,
      {
        name: copyName(name, taken),
        kind,
        location,
        groundElevationM,
        structureHeightM,
        eyeHeightM,
        sector,
        status,
        route,
        speedMps,
        cycleMinutes,
      },
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'create', entityType: 'post', entityId: post.id, after: { ...post, duplicatedFrom: original.id } },
      t,
    );
    return post;
  });
}

/** Refuses a change to a post that a submitted or approved plan uses, naming the plans (409 `post_in_frozen_plan`). */
export async function refuseIfInFrozenPlan(
  actor: Actor,
  postId: string,
  doing: string,
  t: Parameters<typeof plansRepository.withPost>[3],
): Promise<void> {
  const frozen = await plansRepository.withPost(actor.organizationId, postId, ['submitted', 'approved'], t);
  if (frozen.length === 0) return;
  const named = frozen.map((p) => `“${p.title}” (${p.status})`).join(', ');
  throw AppError.conflict(
    `This post is used by ${frozen.length === 1 ? 'a plan' : `${frozen.length} plans`} that ${frozen.length === 1 ? 'is' : 'are'} submitted or approved — ${named} — so it cannot be ${doing}: a submitted or approved plan keeps the posts it was built on. To place it elsewhere, duplicate the post, move the copy and use it in a new version of the plan.`,
    'post_in_frozen_plan',
  );
}
