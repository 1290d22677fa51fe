import type { CoordinateFormat } from '@/shared/geo/types';
import type { CrewCard, CrewCardBasis } from '@/shared/schemas/crew-card';
import type { PlanResultRow } from '@/shared/schemas/plan';
import type { Post, Site } from '@/shared/schemas/site';
import { attachmentsRepository } from '@/server/data/repositories/attachments-repository';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import type { Actor } from '../actor';
import { buildSnapshot } from '../plans/build-snapshot';
import { verifiedRevision } from '../plans/verify-revision';
import { getPost, getSite } from '../sites/manage-sites';
import type { ReportDeps } from './plan-package';
import { renderCrewCard } from './render-crew-card';
import { PRINT_CAUTIONS, isoDateIn, mgrsOf, slug } from './report-text';

/**
 * A post's crew card: position, heights, sector, the ranges per target and
 * condition — frozen in the latest approved plan revision that uses the post
 * (its content hash re-verified), else computed now on smooth earth with the
 * sightline core for the targets and conditions of the site's plans that use
 * the post (the whole library when none does) — the marks photographed from
 * the post with a bearing, and the cautions. Every role of the organisation
 * may read it; observers never see a plan that is not approved through it.
 */
export async function crewCardData(actor: Actor, siteId: string, postId: string): Promise<CrewCard> {
  const site = await getSite(actor, siteId);
  const post = await getPost(actor, siteId, postId);
  const { basis, rows } = await cardFigures(actor, site, post);
  const marks = (await attachmentsRepository.ofOwners(actor.organizationId, [{ ownerType: 'post', ownerIds: [post.id] }]))
    .filter((a) => a.kind === 'photo' && a.bearingDeg !== null)
    .map((a) => ({
      name: a.caption.trim() || a.originalName,
      attachmentId: a.id,
      bearingTrueDeg: a.bearingDeg!,
      bearingMagneticDeg: null,
      distanceM: null,
    }));
  return {
    post: {
      id: post.id,
      name: post.name,
      kind: post.kind,
      status: post.status,
      location: post.location,
      groundElevationM: post.groundElevationM,
      structureHeightM: post.structureHeightM,
      eyeHeightM: post.eyeHeightM,
      heightOfEyeM: rows[0]?.observerHeightM ?? post.groundElevationM + post.structureHeightM + post.eyeHeightM,
      sector: post.sector,
    },
    site: { id: site.id, name: site.name, timeZone: site.timeZone },
    mgrs: mgrsOf(post.location),
    basis,
    rows: rows.map((r) => ({
      targetName: r.targetName,
      conditionSetName: r.conditionSetName,
      k: r.result.k,
      horizonDistanceM: r.result.horizonDistanceM,
      geographicRangeM: r.result.geographicRangeM,
      detectionRangeM: r.result.detectionRangeM,
      limitedBy: r.result.limitedBy,
    })),
    marks,
    declination: null,
    cautions: [...PRINT_CAUTIONS],
    generatedAt: new Date().toISOString(),
  };
}

async function cardFigures(actor: Actor, site: Site, post: Post): Promise<{ basis: CrewCardBasis; rows: PlanResultRow[] }> {
  const plan = await plansRepository.latestApprovedWithPost(actor.organizationId, post.id);
  const latest = plan ? (await plansRepository.revisions(plan.id, true)).at(-1) : undefined;
  if (plan && latest?.snapshot) {
    const revision = verifiedRevision(plan.id, latest);
    const approval = (await plansRepository.reviews(plan.id)).filter((r) => r.decision === 'approve').at(-1);
    return {
      basis: {
        kind: 'approved-plan',
        planId: plan.id,
        planTitle: plan.title,
        version: plan.version,
        revision: revision.number,
        approvedAt: approval?.at ?? plan.updatedAt,
        contentHash: revision.contentHash,
      },
      rows: revision.snapshot!.results.filter((r) => r.postId === post.id),
    };
  }
  // Nothing approved: compute now, for what the site's plans ask of this post (observers: the library).
  const targets = await targetsRepository.list(actor.organizationId);
  const sets = await conditionSetsRepository.list(actor.organizationId);
  const plans =
    actor.role === 'observer'
      ? []
      : (
          await plansRepository.page(actor.organizationId, { siteId: site.id, page: 1, pageSize: 100, sort: '-updatedAt' })
        ).items.filter((p) => p.postIds.includes(post.id));
  const targetIds = new Set(plans.flatMap((p) => p.targetIds));
  const setIds = new Set(plans.flatMap((p) => p.conditionSetIds));
  const chosenTargets = targetIds.size > 0 ? targets.filter((t) => targetIds.has(t.id)) : targets;
  const chosenSets = setIds.size > 0 ? sets.filter((s) => setIds.has(s.id)) : sets;
  const snapshot = buildSnapshot({
    title: post.name,
    standard: { minSeenPct: 0, priorityMinPosts: 1, targetRules: [], crossBearingMinPct: null },
    site,
    posts: [post],
    targets: chosenTargets,
    conditionSets: chosenSets,
  });
  return {
    basis: {
      kind: 'computed',
      scope:
        plans.length > 0
          ? `the targets and conditions of the site’s plans that use this post (${plans.map((p) => p.title).join(', ')})`
          : 'every target and condition set in the organisation’s library',
    },
    rows: snapshot.results,
  };
}

/** The crew card as an A5 PDF, named after the site, the post and the day. */
export async function crewCard(
  deps: ReportDeps,
  actor: Actor,
  siteId: string,
  postId: string,
  options: { coordinateFormat: CoordinateFormat },
): Promise<{ fileName: string; pdf: Buffer }> {
  const card = await crewCardData(actor, siteId, postId);
  const site = await getSite(actor, siteId);
  const others = (await postsRepository.listInSite(actor.organizationId, siteId)).filter((p) => p.id !== postId);
  const pdf = await renderCrewCard(deps, actor, { card, site, others }, options);
  const day = isoDateIn(new Date(card.generatedAt), card.site.timeZone);
  const plan =
    card.basis.kind === 'approved-plan'
      ? `_${slug(card.basis.planTitle)}-v${card.basis.version}-rev${card.basis.revision}`
      : '_no-approved-plan';
  return { fileName: `${slug(card.site.name)}_${slug(card.post.name)}${plan}_crew-card_${day}.pdf`, pdf };
}
