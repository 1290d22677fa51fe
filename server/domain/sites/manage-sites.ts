import type { Post, PostInput, PostListQuery, Site, SiteInput } from '@/shared/schemas/site';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { staleMessage, writeVersioned } from '@/server/domain/audit/versioned-write';

const STALE = staleMessage();

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
