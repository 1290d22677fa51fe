import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { DateTime } from 'luxon';
import { assignmentsRepository } from '@/server/data/repositories/assignments-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import type { RunRoster } from './shore-coverage';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { ViewshedPool } from '@/server/domain/ports/viewshed-pool';
import { computeCoverage, flatTerrain, type ComputeViewsheds } from './compute-coverage';
import type { CoverageRunInputs } from './coverage-inputs';
import { endThrownRun, runProgress } from './queued-runs';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';

/** What a worker needs to compute runs. */
export interface CoverageWorkerDeps extends UseCaseDeps {
  cache: TerrainCache;
  computeViewsheds: ComputeViewsheds;
  /** Least time between progress writes, ms; default 400. */
  progressEveryMs?: number;
}

/**
 * The roster for a coast run's hourly series: the watches of the plan's posts
 * over the site's local day the run is computed on (read now; the series for
 * any other day or week comes from `GET /coverage-runs/:runId/hourly`).
 */
async function runRosterOf(organizationId: string, siteId: string, inputs: CoverageRunInputs): Promise<RunRoster | null> {
  const shore = inputs.site.shore;
  if (!shore) return null;
  const day = DateTime.now().setZone(shore.timeZone).startOf('day');
  const date = day.toISODate()!;
  const ids = new Set(inputs.posts.map((p) => p.id));
  const watches = await assignmentsRepository.inSite(organizationId, siteId, day.toJSDate(), day.plus({ days: 1 }).toJSDate());
  return {
    date,
    readAt: new Date().toISOString(),
    watches: watches
      .filter((w) => ids.has(w.postId))
      .map((w) => ({ postId: w.postId, start: Date.parse(w.startsAt), end: w.endsAt ? Date.parse(w.endsAt) : null })),
  };
}

/** Hidden-height rasters from the worker-thread pool. */
export const poolViewsheds =
  (pool: ViewshedPool): ComputeViewsheds =>
  async (terrain, jobs, onDone) =>
    (await pool.run(terrain, jobs, { onResult: () => onDone() })).map((r) => r.raster);

/**
 * Computes one queued run: loads the terrain (or makes the flat datum),
 * computes the coverage while writing progress, and stores the layers and
 * figures in one transaction. A run cancelled on the way stops at the next
 * progress report, and one cancelled at the very end is not written: a
 * cancelled run leaves no layers. A run whose inputs cannot be computed
 * (a post off the terrain) fails with the reason for people.
 *
 * @returns how the run ended, or `skipped` when it was no longer queued or running
 */
export async function processCoverageRun(
  deps: CoverageWorkerDeps,
  runId: string,
  jobAttempt?: number,
): Promise<'done' | 'cancelled' | 'failed' | 'skipped'> {
  const run = await coverageRepository.findById(runId);
  if (!run || (run.status !== 'queued' && run.status !== 'running')) return 'skipped';
  // A job of an earlier attempt (pg-boss hands out a dead worker's job again much later) finds
  // the run queued again under a newer attempt, which another job carries.
  if (jobAttempt !== undefined && jobAttempt !== run.attempts) return 'skipped';
  const attempt = run.attempts;
  const started = performance.now();
  const begun = await coverageRepository.updateActive(
    runId,
    { status: 'running', progress: 0, stage: 'Loading the terrain', error: null, startedAt: new Date() },
    undefined,
    attempt,
  );
  if (!begun) return 'cancelled';
  const inputs = run.inputs as CoverageRunInputs;
  const report = runProgress(deps.progressEveryMs ?? 400, (changes) =>
    coverageRepository.updateActive(runId, changes, undefined, attempt),
  );
  try {
    let terrain;
    if (run.terrainId) {
      const record = await terrainRepository.findInSite(run.organizationId, run.siteId, run.terrainId);
      if (!record) throw new TerrainInputError('invalid-raster', 'The terrain of this run has been removed.');
      terrain = await deps.cache.loadTerrain(record);
    } else {
      terrain = flatTerrain(inputs.flatGrid!);
    }
    const roster = await runRosterOf(run.organizationId, run.siteId, inputs);
    const result = await computeCoverage(inputs, terrain, deps.computeViewsheds, report, { roster });
    const written = await deps.db.transaction(async (t) => {
      const locked = await coverageRepository.findById(runId, t, true);
      if (locked?.status !== 'running' || locked.attempts !== attempt) return false;
      await coverageRepository.addLayers(runId, result.layers, t);
      await coverageRepository.finish(
        runId,
        { grid: result.grid, cases: result.cases, elapsedS: Math.round(performance.now() - started) / 1000 },
        t,
      );
      return true;
    });
    return written ? 'done' : 'cancelled';
  } catch (error) {
    return endThrownRun('coverage', runId, error, (changes) =>
      coverageRepository.updateActive(runId, changes, undefined, attempt),
    );
  }
}
