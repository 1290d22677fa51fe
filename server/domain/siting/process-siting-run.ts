import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { sitingRepository } from '@/server/data/repositories/siting-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import type { CoverageWorkerDeps } from '../coverage/process-coverage-run';
import { endThrownRun, runProgress } from '../coverage/queued-runs';
import { computeSiting } from './compute-siting';
import type { SitingRunInputs } from './siting-inputs';

/** Seconds between heartbeats while a run computes (progress writes beat too). */
const HEARTBEAT_EVERY_S = 5;

/**
 * Computes one queued siting run, as `processCoverageRun` does a coverage
 * run: marks it running, writes progress (each write also beats the
 * heartbeat, and a timer beats between them), stops at the next progress
 * write once it was cancelled, and writes the result in one transaction only
 * while the run is still running — a cancelled run keeps nothing.
 *
 * @returns how the run ended, or `skipped` when it was no longer queued or running
 */
export async function processSitingRun(
  deps: CoverageWorkerDeps,
  runId: string,
): Promise<'done' | 'cancelled' | 'failed' | 'skipped'> {
  const run = await sitingRepository.findById(runId);
  if (!run || (run.status !== 'queued' && run.status !== 'running')) return 'skipped';
  const started = performance.now();
  const begun = await sitingRepository.updateActive(runId, {
    status: 'running',
    progress: 0,
    stage: 'Loading the terrain',
    error: null,
    startedAt: new Date(),
  });
  if (!begun) return 'cancelled';
  const inputs = run.inputs as SitingRunInputs;
  const report = runProgress(deps.progressEveryMs ?? 400, (changes) => sitingRepository.updateActive(runId, changes));
  const timer = setInterval(() => {
    void sitingRepository.updateActive(runId, {}).catch(() => undefined);
  }, HEARTBEAT_EVERY_S * 1000);
  try {
    const record = await terrainRepository.findInSite(run.organizationId, run.siteId, run.terrainId);
    if (!record) throw new TerrainInputError('invalid-raster', 'The terrain of this run has been removed.');
    const terrain = await deps.cache.loadTerrain(record);
    const result = await computeSiting(inputs, terrain, deps.computeViewsheds, report);
    const written = await deps.db.transaction(async (t) => {
      const locked = await sitingRepository.findById(runId, t, true);
      if (locked?.status !== 'running') return false;
      await sitingRepository.finish(runId, result, Math.round(performance.now() - started) / 1000, t);
      return true;
    });
    return written ? 'done' : 'cancelled';
  } catch (error) {
    return await endThrownRun('siting', runId, error, (changes) => sitingRepository.updateActive(runId, changes));
  } finally {
    clearInterval(timer);
  }
}
