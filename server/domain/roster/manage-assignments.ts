import type { Transaction } from 'sequelize';
import { z } from 'zod';
import type {
  Assignment,
  AssignmentInput,
  AssignmentListQuery,
  Briefing,
  BriefingTerrainView,
  Roster,
} from '@/shared/schemas/assignment';
import type { PlanResultRow, PlanSnapshot } from '@/shared/schemas/plan';
import { LatLonSchema } from '@/shared/schemas/coordinate';
import type { Post } from '@/shared/schemas/site';
import type { TerrainCrs } from '@/shared/terrain/grid-spec';
import { findWatchGaps } from '@/shared/roster/find-watch-gaps';
import { assignmentsRepository } from '@/server/data/repositories/assignments-repository';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import { verifiedRevision } from '../plans/verify-revision';
import { postTerrainView } from './post-terrain-view';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { staleMessage, writeVersioned } from '@/server/domain/audit/versioned-write';

const DAY = 24 * 3600_000;
/** Hand-overs shorter than this are not reported as gaps. */
const MIN_GAP_MS = 5 * 60_000;
const STALE = staleMessage('this watch');

/** A window from the query, defaulting to the next seven days. */
function windowOf(q: { from?: string; to?: string }, now = Date.now()) {
  const from = q.from ? new Date(q.from) : new Date(now);
  const to = q.to ? new Date(q.to) : new Date(from.getTime() + 7 * DAY);
  if (!(to > from)) throw AppError.badRequest('The window has invalid fields.', { to: 'The window must end after it starts.' });
  if (to.getTime() - from.getTime() > 400 * DAY) {
    throw AppError.badRequest('The window has invalid fields.', { to: 'A window is at most 400 days.' });
  }
  return { from, to };
}

/** Observers see their own watches; everyone else the organisation's. */
export function listAssignments(actor: Actor, query: AssignmentListQuery) {
  const { from, to } = windowOf(query);
  const userId = actor.role === 'observer' ? actor.userId : query.userId;
  return assignmentsRepository.page(actor.organizationId, { ...query, userId, from, to });
}

async function refuseClash(
  actor: Actor,
  userId: string,
  startsAt: Date,
  endsAt: Date | null,
  exceptId: string | null,
  t: Transaction,
) {
  const clash = await assignmentsRepository.clashFor(actor.organizationId, userId, startsAt, endsAt, exceptId, t);
  if (clash) {
    throw AppError.conflict(
      `${clash.person.name} already watches ${clash.postName} from ${clash.startsAt.slice(0, 16).replace('T', ' ')} UTC${clash.endsAt ? ` to ${clash.endsAt.slice(0, 16).replace('T', ' ')} UTC` : ' on'}.`,
      'assignment_overlap',
    );
  }
}

export function createAssignment({ db }: UseCaseDeps, actor: Actor, input: AssignmentInput): Promise<Assignment> {
  return db.transaction(async (t) => {
    const post = await postsRepository.findInOrganization(actor.organizationId, input.postId, t);
    const person = await usersRepository.findInOrganization(actor.organizationId, input.userId, t);
    const fields: Record<string, string> = {};
    if (!post) fields.postId = 'No such post in your organisation.';
    if (!person) fields.userId = 'No such person in your organisation.';
    else if (person.status === 'deactivated') fields.userId = `${person.name} is deactivated.`;
    if (Object.keys(fields).length) throw AppError.badRequest('The watch has invalid fields.', fields);
    const startsAt = new Date(input.startsAt);
    const endsAt = input.endsAt ? new Date(input.endsAt) : null;
    await refuseClash(actor, input.userId, startsAt, endsAt, null, t);
    const created = await assignmentsRepository.create(
      actor.organizationId,
      { postId: input.postId, userId: input.userId, startsAt, endsAt, note: input.note },
      t,
    );
    await auditRepository.record(actor, { action: 'create', entityType: 'assignment', entityId: created.id, after: created }, t);
    return created;
  });
}

export function updateAssignment(
  { db }: UseCaseDeps,
  actor: Actor,
  id: string,
  input: { startsAt?: string; endsAt?: string | null; note?: string; version: number },
): Promise<Assignment> {
  return db.transaction(async (t) => {
    const before = await assignmentsRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That watch');
    const startsAt = new Date(input.startsAt ?? before.startsAt);
    const end = input.endsAt === undefined ? before.endsAt : input.endsAt;
    const endsAt = end ? new Date(end) : null;
    if (endsAt && !(endsAt > startsAt)) {
      throw AppError.badRequest('The watch has invalid fields.', { endsAt: 'The watch must end after it starts.' });
    }
    await refuseClash(actor, before.person.id, startsAt, endsAt, id, t);
    return writeVersioned(actor, t, { entityType: 'assignment', entityId: id, before, stale: STALE }, () =>
      assignmentsRepository.updateIfVersion(
        actor.organizationId,
        id,
        input.version,
        { startsAt, endsAt, ...(input.note !== undefined && { note: input.note }) },
        t,
      ),
    );
  });
}

export function deleteAssignment({ db }: UseCaseDeps, actor: Actor, id: string): Promise<void> {
  return db.transaction(async (t) => {
    const before = await assignmentsRepository.find(actor.organizationId, id, t);
    if (!before) throw AppError.notFound('That watch');
    await assignmentsRepository.softDelete(actor.organizationId, id, t);
    await auditRepository.record(actor, { action: 'delete', entityType: 'assignment', entityId: id, before }, t);
  });
}

/** Each post of a site with its watches in the window and the stretches nobody covers. */
export async function siteRoster(actor: Actor, siteId: string, query: { from?: string; to?: string }): Promise<Roster> {
  const site = await sitesRepository.findInOrganization(actor.organizationId, siteId);
  if (!site) throw AppError.notFound('That site');
  const { from, to } = windowOf(query);
  const posts = await postsRepository.listInSite(actor.organizationId, siteId);
  const watches = await assignmentsRepository.inSite(actor.organizationId, siteId, from, to);
  return {
    siteId,
    from: from.toISOString(),
    to: to.toISOString(),
    posts: posts.map((p) => {
      const assignments = watches.filter((w) => w.postId === p.id);
      const gaps = findWatchGaps(
        assignments.map((w) => ({ start: Date.parse(w.startsAt), end: w.endsAt ? Date.parse(w.endsAt) : null })),
        { start: from.getTime(), end: to.getTime() },
        MIN_GAP_MS,
      );
      return {
        postId: p.id,
        postName: p.name,
        assignments,
        gaps: gaps.map((g) => ({ from: new Date(g.start).toISOString(), to: new Date(g.end).toISOString() })),
      };
    }),
  };
}

/** The organisation's active people, for pickers. */
export async function listPeople(actor: Actor) {
  const users = await usersRepository.listInOrganization(actor.organizationId);
  return users.filter((u) => u.status !== 'deactivated').map((u) => ({ id: u.id, name: u.name, role: u.role }));
}

/**
 * A lookout's briefing: their watches from now for two weeks and, for each
 * post, the latest approved plan that uses it with that post's frozen results.
 */
export async function briefingFor(actor: Actor, now = Date.now()): Promise<Briefing> {
  const { items: assignments } = await assignmentsRepository.page(actor.organizationId, {
    userId: actor.userId,
    from: new Date(now),
    to: new Date(now + 14 * DAY),
    sort: 'startsAt',
    page: 1,
    pageSize: 100,
  });
  const postIds = [...new Set(assignments.map((a) => a.postId))];
  const posts = await Promise.all(
    postIds.map(async (postId) => {
      const post = await postsRepository.findInOrganization(actor.organizationId, postId);
      if (!post) return null;
      const plan = await plansRepository.latestApprovedWithPost(actor.organizationId, postId);
      const latest = plan ? (await plansRepository.revisions(plan.id, true)).at(-1) : undefined;
      const revision = plan && latest ? verifiedRevision(plan.id, latest) : undefined;
      const approval = plan ? (await plansRepository.reviews(plan.id)).filter((r) => r.decision === 'approve').at(-1) : undefined;
      const snapshot = revision?.snapshot;
      const results = snapshot ? snapshot.results.filter((r) => r.postId === postId) : [];
      const terrain = await terrainRepository.findActive(actor.organizationId, post.siteId);
      const terrainView = snapshot?.coverage ? await terrainViewOf(actor, post, snapshot, results) : null;
      return {
        post,
        siteName: assignments.find((a) => a.postId === postId)!.siteName,
        plan:
          plan && revision
            ? {
                id: plan.id,
                title: plan.title,
                version: plan.version,
                revision: revision.number,
                approvedAt: approval?.at ?? plan.updatedAt,
              }
            : null,
        results,
        basis: terrainView ? ('terrain' as const) : ('smooth-earth' as const),
        terrainView,
        siteHasTerrain: terrain !== null,
        cautions: terrainView ? onTerrain(snapshot?.cautions ?? []) : (snapshot?.cautions ?? []),
      };
    }),
  );
  return { assignments, posts: posts.filter((p): p is NonNullable<typeof p> => p !== null) };
}

/** The post's view over the terrain from the revision's frozen coverage run (null on the flat datum). */
async function terrainViewOf(
  actor: Actor,
  post: Post,
  snapshot: PlanSnapshot,
  results: PlanResultRow[],
): Promise<BriefingTerrainView | null> {
  const coverage = snapshot.coverage;
  if (!coverage || coverage.datum !== 'terrain' || coverage.terrainId === null) return null;
  let crs: TerrainCrs;
  if (coverage.grid.epsg !== null) crs = { epsg: coverage.grid.epsg, wkt: null };
  else {
    const terrain = await terrainRepository.findInSite(actor.organizationId, post.siteId, coverage.terrainId);
    if (!terrain) return null;
    crs = { epsg: terrain.epsg, wkt: terrain.crsWkt };
  }
  // The boundary as the revision froze it; today's when the revision did not keep one.
  const frozen = BoundarySchema.safeParse(snapshot.inputs.site.boundary);
  const boundary = frozen.success
    ? frozen.data
    : ((await sitesRepository.findInOrganization(actor.organizationId, post.siteId))?.boundary ?? null);
  // Where the post stood when the revision was made (the run was computed there), today's place otherwise.
  const frozenPost = snapshot.inputs.posts.find((p) => p.id === post.id);
  const place = LatLonSchema.safeParse(frozenPost?.location);
  const location = place.success ? place.data : post.location;
  return postTerrainView({ coverage, crs, post: { ...post, location }, boundary, results });
}

const BoundarySchema = z.array(z.tuple([z.number(), z.number()])).min(3);

/** The plan's cautions for figures over terrain: the smooth-sphere wording of `estimates-only` does not fit them. */
function onTerrain(cautions: { code: string; message: string }[]) {
  return cautions.map((c) =>
    c.code === 'estimates-only'
      ? {
          code: c.code,
          message:
            'These figures are estimates from the site’s terrain model at its cell size with uniform refraction; trees, buildings and ground finer than the cells are not included.',
        }
      : c,
  );
}
