import { UniqueConstraintError } from 'sequelize';
import type { CoverageComparison, CoverageLayerName, CoverageRun, PlanCoverage } from '@/shared/schemas/coverage';
import { compareCoverage } from '@/shared/terrain/coverage-difference';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { COVERAGE_LAYER, type PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import { gridSpecFromM, type GridSpec } from '@/shared/terrain/grid-spec';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { coverageRepository, type CoverageRunRecord } from '@/server/data/repositories/coverage-repository';
import { plansRepository } from '@/server/data/repositories/plans-repository';
import { AppError } from '@/server/domain/app-error';
import type { CoverageQueue } from '@/server/domain/ports/coverage-queue';
import type { Actor } from '../actor';
import { getPlan, loadPlanInputs } from '../plans/manage-plans';
import { cancelActiveRun } from './cancel-active-run';
import { ringOnGrid } from './compute-coverage';
import type { CoverageRunInputs } from './coverage-inputs';
import { currentCoverageInputs } from './coverage-snapshot';
import { enqueueRun, runStateOf } from './queued-runs';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import { isEditablePlanStatus } from '@/shared/plans/editable-plan-statuses';

/** What the coverage use cases need. */
export interface CoverageDeps extends UseCaseDeps {
  /** The job queue; null when this server runs without one (runs cannot be started). */
  queue: CoverageQueue | null;
}

/** The API shape of a run; `currentHash` is the plan's inputs hash today, when known. */
export function toCoverageRun(run: CoverageRunRecord, currentHash: string | null): CoverageRun {
  return {
    id: run.id,
    planId: run.planId,
    siteId: run.siteId,
    terrainId: run.terrainId,
    datum: run.datum,
    inputsHash: run.inputsHash,
    ...runStateOf(run),
    current: currentHash === run.inputsHash,
    grid: run.grid,
    cases: run.cases,
    elapsedS: run.elapsedS,
    skippedConditions: (run.inputs as CoverageRunInputs).skippedConditions ?? [],
  };
}

async function planInputsHash(actor: Actor, planId: string) {
  const plan = await getPlan(actor, planId);
  const loaded = await loadPlanInputs(actor, plan);
  return { plan, ...(await currentCoverageInputs(actor.organizationId, plan, loaded)) };
}

/** The plan's run for today's inputs, its newest run, and whether its site has terrain. */
export async function planCoverage(actor: Actor, planId: string): Promise<PlanCoverage> {
  const { inputsHash, hasTerrain } = await planInputsHash(actor, planId);
  const [current, latest] = await Promise.all([
    coverageRepository.findCurrent(planId, inputsHash),
    coverageRepository.latest(planId),
  ]);
  return {
    inputsHash,
    current: current && toCoverageRun(current, inputsHash),
    latest: latest && toCoverageRun(latest, inputsHash),
    hasTerrain,
  };
}

/**
 * When an identical request inserted its run first (the unique index on a plan's
 * queued/running runs per inputs hash refused ours), the run it created.
 */
const orRunThatWonTheRace = (planId: string, inputsHash: string) => async (error: unknown) => {
  if (!(error instanceof UniqueConstraintError)) throw error;
  const existing = await coverageRepository.findCurrent(planId, inputsHash);
  if (!existing) throw error;
  return { ...existing, raced: true as const };
};

/**
 * Queues a coverage run for the plan's inputs today, or returns the run
 * already queued, running or done for exactly these inputs.
 */
export async function requestCoverage(
  deps: CoverageDeps,
  actor: Actor,
  planId: string,
): Promise<{ run: CoverageRun; created: boolean }> {
  const { plan, inputs, inputsHash } = await planInputsHash(actor, planId);
  if (!isEditablePlanStatus(plan.status)) {
    throw AppError.conflict(
      `A ${plan.status} plan keeps the coverage frozen with its revision. Start a new version to compute again.`,
      'plan_frozen',
    );
  }
  if (!inputs.terrain && !inputs.flatGrid) {
    throw AppError.conflict(
      'This site has neither terrain nor a boundary: draw the boundary (or upload terrain) so there is an area to cover.',
      'site_has_no_area',
    );
  }
  if (inputs.conditions.length === 0) {
    throw AppError.conflict(
      'Every condition of this plan is a duct (k ≥ 1), where the seen area is not defined. Add a condition with k below 1.',
      'no_computable_conditions',
    );
  }
  const existing = await coverageRepository.findCurrent(planId, inputsHash);
  if (existing) return { run: toCoverageRun(existing, inputsHash), created: false };
  if (!deps.queue) throw new AppError(503, 'queue_unavailable', 'No coverage workers are configured on this server.');
  const run = await deps.db
    .transaction(async (t) => {
      const created = await coverageRepository.create(
        {
          organizationId: actor.organizationId,
          planId,
          siteId: plan.siteId,
          terrainId: inputs.terrain?.id ?? null,
          datum: inputs.terrain ? 'terrain' : 'flat',
          inputsHash,
          inputs,
          requestedById: actor.userId,
        },
        t,
      );
      await auditRepository.record(
        actor,
        { action: 'coverage-request', entityType: 'plan', entityId: planId, after: { runId: created.id, inputsHash } },
        t,
      );
      return created;
    })
    .catch(orRunThatWonTheRace(planId, inputsHash));
  if ('raced' in run) return { run: toCoverageRun(run, inputsHash), created: false };
  await enqueueRun(deps.queue, run.id, (changes) => coverageRepository.updateActive(run.id, changes));
  return { run: toCoverageRun((await coverageRepository.findById(run.id))!, inputsHash), created: true };
}

/** A run of the caller's organisation; observers only see runs of approved plans. */
export async function visibleRun(actor: Actor, runId: string): Promise<CoverageRunRecord> {
  const run = await coverageRepository.find(actor.organizationId, runId);
  if (!run) throw AppError.notFound('That coverage run');
  if (actor.role === 'observer') {
    const plan = await plansRepository.find(actor.organizationId, run.planId);
    if (plan?.status !== 'approved') throw AppError.notFound('That coverage run');
  }
  return run;
}

export async function getCoverageRun(actor: Actor, runId: string): Promise<CoverageRun> {
  const run = await visibleRun(actor, runId);
  // Whether it is current only matters while the plan can change.
  const plan = await plansRepository.find(actor.organizationId, run.planId);
  const currentHash =
    plan && isEditablePlanStatus(plan.status) ? (await planInputsHash(actor, run.planId)).inputsHash : run.inputsHash;
  return toCoverageRun(run, currentHash);
}

/** Stops a queued or running run; whatever it had computed is dropped. */
export async function cancelCoverageRun(deps: CoverageDeps, actor: Actor, runId: string): Promise<CoverageRun> {
  const run = await visibleRun(actor, runId);
  await cancelActiveRun(deps, actor, run, coverageRepository, {
    action: 'coverage-cancel',
    entityType: 'plan',
    entityId: run.planId,
  });
  return getCoverageRun(actor, runId);
}

/** One stored layer of a finished run. */
export async function coverageLayer(
  actor: Actor,
  runId: string,
  layer: CoverageLayerName,
  caseKey: string,
  postId: string | undefined,
) {
  const run = await visibleRun(actor, runId);
  if (run.status !== 'done') throw AppError.conflict('The run has not finished: it has no layers yet.', 'run_not_done');
  if (!run.cases.some((c) => c.key === caseKey)) {
    throw AppError.badRequest('No such case in this run.', { caseKey: 'Not a case of this run.' });
  }
  const perPost = layer === 'post-visibility' || layer === 'patrol-fraction';
  if (perPost) {
    if (!postId) throw AppError.badRequest('Name the post.', { postId: 'Give the post whose view you want.' });
    if (!run.cases[0]!.posts.some((p) => p.postId === postId))
      throw AppError.badRequest('No such post in this run.', { postId: 'Not a post of this run.' });
    if (layer === 'patrol-fraction' && !(run.cases[0]!.patrols ?? []).some((p) => p.postId === postId))
      throw AppError.badRequest('That post does not patrol in this run.', { postId: 'Not a patrol of this run.' });
  }
  const encoded = await coverageRepository.layer(runId, caseKey, layer, perPost ? postId! : '');
  if (!encoded) throw AppError.notFound('That layer');
  return encoded;
}

const gridOf = (run: CoverageRunRecord): GridSpec => gridSpecFromM(run.grid!, { epsg: run.grid!.epsg, wkt: null });

/** Posts per cell back from the stored layer codes (3 stands for three or more). */
function postsPerCellOf(grid: GridSpec, codes: Uint8Array): PostsPerCellRaster {
  const counts = new Uint8Array(codes.length);
  const noData = new Uint8Array(codes.length);
  for (let i = 0; i < codes.length; i++) {
    const code = codes[i]!;
    if (code === COVERAGE_LAYER.noData) noData[i] = 1;
    else counts[i] = code - COVERAGE_LAYER.unseen;
  }
  return { ...grid, counts, noData, layer: codes, postCount: 0 };
}

/**
 * What changes between two finished runs on the same grid (two plans of a
 * site, or two versions of one plan) for one case: gained and lost cells of
 * the site, from run `a` (before) to run `b` (after).
 */
export async function compareCoverageRuns(
  actor: Actor,
  query: { a: string; b: string; caseKey: string; caseKeyB?: string },
): Promise<CoverageComparison> {
  const [a, b] = await Promise.all([visibleRun(actor, query.a), visibleRun(actor, query.b)]);
  for (const [run, field] of [
    [a, 'a'],
    [b, 'b'],
  ] as const) {
    if (run.status !== 'done') {
      throw AppError.badRequest('Both runs must have finished.', { [field]: 'This run has not finished.' });
    }
  }
  const same = a.siteId === b.siteId && a.terrainId === b.terrainId && JSON.stringify(a.grid) === JSON.stringify(b.grid);
  if (!same) {
    throw AppError.conflict(
      'These runs are on different sites or terrain grids, so their cells cannot be compared.',
      'runs_not_comparable',
    );
  }
  const caseKeyB = query.caseKeyB ?? query.caseKey;
  const caseA = a.cases.find((c) => c.key === query.caseKey);
  const caseB = b.cases.find((c) => c.key === caseKeyB);
  if (!caseA || !caseB) {
    throw AppError.badRequest('No such case in the runs.', {
      ...(!caseA && { caseKey: 'Not a case of run a.' }),
      ...(!caseB && { [query.caseKeyB ? 'caseKeyB' : 'caseKey']: 'Not a case of run b.' }),
    });
  }
  const grid = gridOf(a);
  const [layerA, layerB] = await Promise.all([
    coverageRepository.layer(a.id, caseA.key, 'posts-per-cell', ''),
    coverageRepository.layer(b.id, caseB.key, 'posts-per-cell', ''),
  ]);
  if (!layerA || !layerB) throw AppError.notFound('That layer');
  const boundary = (a.inputs as CoverageRunInputs).site.boundary;
  const mask = boundary ? rasterizePolygon(grid, [ringOnGrid(gridProjection(grid.crs), boundary)]) : null;
  const difference = compareCoverage(
    postsPerCellOf(grid, decodeClassRaster(layerA)),
    postsPerCellOf(grid, decodeClassRaster(layerB)),
    mask,
  );
  return {
    a: { runId: a.id, planId: a.planId, caseKey: caseA.key, site: caseA.site },
    b: { runId: b.id, planId: b.planId, caseKey: caseB.key, site: caseB.site },
    difference: encodeClassRaster(grid, difference.changes),
    statistics: difference.statistics,
  };
}
