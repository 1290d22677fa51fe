// Over 300 lines: the five siting use cases (request, read, list, cancel, make a plan) with the input freezing and the mapper they share.
import type { Plan } from '@/shared/schemas/plan';
import type { Post } from '@/shared/schemas/site';
import type { SitingRun, SitingRunRequest } from '@/shared/schemas/siting';
import type { LatLon } from '@/shared/geo/types';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { gridSpecFromM } from '@/shared/terrain/grid-spec';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitingRepository, type SitingRunRecord } from '@/server/data/repositories/siting-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { AppError, type FieldErrors } from '@/server/domain/app-error';
import type { CoverageQueue } from '@/server/domain/ports/coverage-queue';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import type { Actor } from '../actor';
import { cancelActiveRun } from '../coverage/cancel-active-run';
import { enqueueRun, runStateOf } from '../coverage/queued-runs';
import { buildCoverageInputs } from '../coverage/coverage-inputs';
import { getSite } from '../sites/manage-sites';
import type { SitingResult } from './compute-siting';
import { describeCandidate, sitingInputsHash, type FrozenCandidate, type SitingRunInputs } from './siting-inputs';

/** What the siting use cases need. */
export interface SitingDeps extends UseCaseDeps {
  /** The siting job queue; null when this server runs without one (runs cannot be started). */
  queue: CoverageQueue | null;
}

const DEFAULT_STANDARD: Plan['standard'] = { minSeenPct: 70, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null };
const DEFAULT_LOOKOUT: Plan['lookout'] = { resolutionArcmin: 1, magnification: 1 };

/** 400 `invalid_input` with the fields at fault (a request naming things that do not fit), as the API answers any bad field. */
const unfit = (message: string, fields: FieldErrors) => AppError.badRequest(message, fields);

/** The API shape of a run. */
export function toSitingRun(run: SitingRunRecord): SitingRun {
  const inputs = run.inputs as SitingRunInputs;
  const result = run.result as SitingResult | null;
  return {
    id: run.id,
    siteId: run.siteId,
    ...runStateOf(run),
    elapsedS: run.elapsedS,
    inputsHash: run.inputsHash,
    targetId: inputs.targetId,
    targetName: inputs.targetName,
    conditionSetId: inputs.conditionSetId,
    conditionSetName: inputs.conditionSetName,
    heightsM: inputs.heightsM,
    count: inputs.count,
    objective: { minPosts: inputs.minPosts, zoneWeights: inputs.zoneWeights },
    keepPostIds: inputs.keepPostIds,
    candidates: result?.candidates ?? (inputs.candidates ?? []).map(describeCandidate),
    method: result?.method ?? null,
    siteAreaM2: result?.siteAreaM2 ?? null,
    keptSeenM2: result?.keptSeenM2 ?? null,
    keptSeenPct: result?.keptSeenPct ?? null,
    steps: result?.steps ?? [],
    chosen: result?.chosen ?? [],
    addedLayer: result?.addedLayer ?? null,
    grid: result?.grid ?? null,
    planId: run.planId,
  };
}

/** The site's newest approved plan's standard and lookout, else the defaults a new plan gets. */
async function standardOfSite(organizationId: string, siteId: string) {
  const approved = await plansRepository.page(organizationId, {
    statuses: ['approved'],
    siteId,
    sort: '-updatedAt',
    page: 1,
    pageSize: 1,
  } as Parameters<typeof plansRepository.page>[1]);
  const plan = approved.items[0];
  return { standard: plan?.standard ?? DEFAULT_STANDARD, lookout: plan?.lookout ?? DEFAULT_LOOKOUT };
}

/** Resolves the request against the site, its posts, terrain and the library, and freezes it. */
async function freezeInputs(actor: Actor, siteId: string, input: SitingRunRequest) {
  const site = await getSite(actor, siteId);
  const terrain = await terrainRepository.findActive(actor.organizationId, siteId);
  if (!terrain) {
    throw AppError.conflict(`${site.name} has no terrain: upload one first, siting needs the ground's shape.`, 'no_terrain');
  }
  const posts = await postsRepository.listInSite(actor.organizationId, siteId);
  const byId = new Map(posts.map((p) => [p.id, p]));
  const fields: FieldErrors = {};
  // Every place must stand on the terrain: asked now, so the run does not fail later on one stray post.
  const crs = { epsg: terrain.epsg, wkt: terrain.crsWkt };
  const projection = gridProjection(crs);
  const grid = gridSpecFromM(
    { width: terrain.width, height: terrain.height, cellSizeM: terrain.cellSizeM, xllM: terrain.xllM, yllM: terrain.yllM },
    crs,
  );
  const offTerrain = (at: LatLon) => {
    const { x, y } = projection.toGrid(at);
    try {
      locatePostCell(grid, x, y);
      return false;
    } catch (error) {
      if (error instanceof TerrainInputError) return true;
      throw error;
    }
  };
  const kept: Post[] = [];
  input.keepPostIds.forEach((id, i) => {
    const post = byId.get(id);
    if (!post) fields[`keepPostIds.${i}`] = 'No such post on this site.';
    else if (offTerrain(post.location))
      fields[`keepPostIds.${i}`] = `${post.name} stands outside the site's terrain: leave it out, or move it onto the terrain.`;
    else kept.push(post);
  });
  let candidates: FrozenCandidate[] | null = null;
  if (Array.isArray(input.candidates)) {
    candidates = input.candidates.map((c, index) => {
      if ('postId' in c) {
        const post = byId.get(c.postId);
        if (!post) fields[`candidates.${index}.postId`] = 'No such post on this site.';
        else if (input.keepPostIds.includes(c.postId))
          fields[`candidates.${index}.postId`] = 'This post is kept already; a candidate must be a new place.';
        else if (offTerrain(post.location))
          fields[`candidates.${index}.postId`] = `${post.name} stands outside the site's terrain: it cannot be judged there.`;
        return {
          index,
          name: post?.name ?? '',
          postId: c.postId,
          latDeg: post?.location.latDeg ?? 0,
          lonDeg: post?.location.lonDeg ?? 0,
          source: 'post' as const,
          eyeHeightM: post?.eyeHeightM ?? input.eyeHeightM,
          sector: post?.sector ?? null,
          post: post
            ? { kind: post.kind, structureHeightM: post.structureHeightM, groundElevationM: post.groundElevationM }
            : null,
        };
      }
      if (offTerrain(c))
        fields[`candidates.${index}.latDeg`] = `${c.name} lies outside the site's terrain: it cannot be judged there.`;
      return {
        index,
        name: c.name,
        postId: null,
        latDeg: c.latDeg,
        lonDeg: c.lonDeg,
        source: 'point' as const,
        eyeHeightM: input.eyeHeightM,
        sector: null,
        post: null,
      };
    });
    const seen = new Set<string>();
    input.candidates.forEach((c, i) => {
      if ('postId' in c && seen.has(c.postId)) fields[`candidates.${i}.postId`] = 'This post is a candidate twice.';
      if ('postId' in c) seen.add(c.postId);
    });
  }
  const target = (await targetsRepository.list(actor.organizationId)).find((t) => t.id === input.targetId);
  if (!target) fields.targetId = 'No such target in your library.';
  const set = (await conditionSetsRepository.list(actor.organizationId)).find((s) => s.id === input.conditionSetId);
  if (!set) fields.conditionSetId = 'No such condition set in your library.';
  if (Object.keys(fields).length > 0) throw unfit('The siting request names things that do not fit this site.', fields);

  const { standard, lookout } = await standardOfSite(actor.organizationId, siteId);
  const coverage = buildCoverageInputs({
    site,
    terrain: { id: terrain.id, sha256: terrain.sha256 },
    posts: kept,
    targets: [target!],
    conditionSets: [set!],
    standard,
    lookout,
  });
  if (coverage.conditions.length === 0) {
    throw unfit('Every condition of this set is a duct (k ≥ 1), where the seen area is not defined.', {
      conditionSetId: 'Choose a set with a condition below k = 1.',
    });
  }
  const fromTerrain = Array.isArray(input.candidates) ? null : input.candidates.fromTerrain;
  const inputs: SitingRunInputs = {
    terrain: coverage.terrain!,
    site: coverage.site,
    target: coverage.targets[0]!,
    conditions: coverage.conditions,
    skippedConditions: coverage.skippedConditions,
    earthRadiusM: coverage.earthRadiusM,
    resolutionArcmin: coverage.resolutionArcmin,
    detectionModel: coverage.detectionModel,
    blindAreaMinAreaM2: coverage.blindAreaMinAreaM2,
    kept: coverage.posts,
    keepPostIds: input.keepPostIds,
    candidates,
    fromTerrain: fromTerrain && {
      spacingM: fromTerrain.spacingM,
      maxCandidates: fromTerrain.maxCandidates,
      accessLine: fromTerrain.accessLine,
    },
    heightsM: input.heightsM,
    costs: input.costs,
    budget: input.budget,
    goalPct: input.goalPct,
    eyeHeightM: input.eyeHeightM,
    count: input.count,
    minPosts: input.objective.minPosts,
    zoneWeights: input.objective.zoneWeights,
    targetId: target!.id,
    targetName: target!.name,
    conditionSetId: set!.id,
    conditionSetName: set!.name,
    standard,
    lookout,
  };
  return { inputs, terrainId: terrain.id };
}

/** Queues a siting run for the site (planners). */
export async function requestSiting(deps: SitingDeps, actor: Actor, siteId: string, input: SitingRunRequest): Promise<SitingRun> {
  const { inputs, terrainId } = await freezeInputs(actor, siteId, input);
  if (!deps.queue) throw new AppError(503, 'queue_unavailable', 'No workers are configured on this server.');
  const inputsHash = sitingInputsHash(inputs);
  const run = await deps.db.transaction(async (t) => {
    const created = await sitingRepository.create(
      { organizationId: actor.organizationId, siteId, terrainId, inputsHash, inputs, requestedById: actor.userId },
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'siting-request', entityType: 'site', entityId: siteId, after: { runId: created.id, inputsHash } },
      t,
    );
    return created;
  });
  await enqueueRun(deps.queue, run.id, (changes) => sitingRepository.updateActive(run.id, changes));
  return toSitingRun((await sitingRepository.findById(run.id))!);
}

/** Observers do not plan: runs are for planners and reviewers of the organisation. */
async function visibleRun(actor: Actor, runId: string): Promise<SitingRunRecord> {
  const run = actor.role === 'observer' ? null : await sitingRepository.find(actor.organizationId, runId);
  if (!run) throw AppError.notFound('That siting run');
  return run;
}

export async function getSitingRun(actor: Actor, runId: string): Promise<SitingRun> {
  return toSitingRun(await visibleRun(actor, runId));
}

/** The site's newest runs. */
export async function listSitingRuns(actor: Actor, siteId: string): Promise<SitingRun[]> {
  await getSite(actor, siteId);
  if (actor.role === 'observer') return [];
  return (await sitingRepository.listInSite(actor.organizationId, siteId)).map(toSitingRun);
}

/** Stops a queued or running run; it keeps no result. */
export async function cancelSitingRun(deps: SitingDeps, actor: Actor, runId: string): Promise<SitingRun> {
  const run = await visibleRun(actor, runId);
  await cancelActiveRun(deps, actor, run, sitingRepository, {
    action: 'siting-cancel',
    entityType: 'site',
    entityId: run.siteId,
  });
  return getSitingRun(actor, runId);
}

/**
 * A draft plan from a finished run: the kept posts and the chosen ones, for
 * the run's target and condition set, with the standard and lookout the run
 * froze. A chosen post at its own structure height is used as it is; any
 * other choice becomes a new proposed tower on the site (a post's copy at the
 * new height, or the point), all in one transaction with the plan.
 */
export async function planFromSiting(deps: UseCaseDeps, actor: Actor, runId: string): Promise<Plan> {
  const run = await visibleRun(actor, runId);
  if (run.status !== 'done') throw AppError.conflict('The run has not finished: it has no choice yet.', 'run_not_done');
  if (run.planId) throw AppError.conflict('A draft plan was made from this run already.', 'plan_exists');
  const inputs = run.inputs as SitingRunInputs;
  const result = run.result as SitingResult;
  const frozen = new Map((inputs.candidates ?? []).map((c) => [c.index, c]));
  return deps.db.transaction(async (t) => {
    const postIds = [...inputs.keepPostIds];
    for (const choice of result.chosen) {
      const c = choice.candidate;
      const source = frozen.get(c.index);
      if (c.postId && source?.post && source.post.structureHeightM === choice.heightM) {
        postIds.push(c.postId);
        continue;
      }
      const ground = result.candidateGroundM[c.index] ?? source?.post?.groundElevationM ?? 0;
      const post = await postsRepository.create(
        actor.organizationId,
        run.siteId,
        {
          name: `${c.name} · ${choice.heightM} m tower`.slice(0, 120),
          kind: 'tower',
          location: { latDeg: c.latDeg, lonDeg: c.lonDeg },
          groundElevationM: Math.round(ground * 10) / 10,
          structureHeightM: choice.heightM,
          eyeHeightM: source?.eyeHeightM ?? inputs.eyeHeightM,
          sector: source?.sector ?? null,
          status: 'proposed',
        },
        t,
      );
      await auditRepository.record(actor, { action: 'create', entityType: 'post', entityId: post.id, after: post }, t);
      postIds.push(post.id);
    }
    const plan = await plansRepository.create(
      actor.organizationId,
      actor.userId,
      {
        siteId: run.siteId,
        title: `Siting: ${result.chosen.length} new ${result.chosen.length === 1 ? 'tower' : 'towers'} for ${inputs.targetName}`,
        postIds,
        targetIds: [inputs.targetId],
        conditionSetIds: [inputs.conditionSetId],
        standard: inputs.standard,
        lookout: inputs.lookout,
      },
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'create', entityType: 'plan', entityId: plan.id, after: { ...plan, fromSitingRun: runId } },
      t,
    );
    if (!(await sitingRepository.setPlan(runId, plan.id, t))) {
      throw AppError.conflict('A draft plan was made from this run already.', 'plan_exists');
    }
    return plan;
  });
}
