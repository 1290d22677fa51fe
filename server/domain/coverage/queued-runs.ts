import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { CoverageQueue } from '@/server/domain/ports/coverage-queue';
import type { ReportProgress } from './compute-coverage';

/*
 * What every queued job run (coverage, siting) does the same way: handing the
 * stored run to the queue, writing progress while it computes, ending it when
 * the computation throws, and answering where it stands. Each caller passes
 * its own repository's guarded update ("only while the run is still queued or
 * running").
 */

/** Changes a run that has not ended; false when it had (nothing changed). */
type UpdateActive<Changes> = (changes: Changes) => Promise<boolean>;

/**
 * Hands a stored run to the queue and keeps the job's id on it. When the
 * queue cannot take it, marks the run failed (so it does not stay queued with
 * no job) and throws the queue's error.
 */
export async function enqueueRun(
  queue: CoverageQueue,
  runId: string,
  updateActive: UpdateActive<{ jobId: string } | { status: 'failed'; error: string; finishedAt: Date }>,
): Promise<void> {
  try {
    const jobId = await queue.enqueue(runId);
    await updateActive({ jobId });
  } catch (error) {
    await updateActive({ status: 'failed', error: 'The job queue could not take the run. Try again.', finishedAt: new Date() });
    throw error;
  }
}

/** Thrown inside a run when its status says it was cancelled. */
export class RunCancelled extends Error {}

/**
 * The progress a run reports: written at most once every `everyMs` (and
 * always from 0.99 on); throws `RunCancelled` when the write finds the run
 * ended, so the computation stops there.
 */
export function runProgress(everyMs: number, updateActive: UpdateActive<{ progress: number; stage: string }>): ReportProgress {
  let lastWrite = 0;
  return async (progress, stage) => {
    const now = performance.now();
    if (now - lastWrite < everyMs && progress < 0.99) return;
    lastWrite = now;
    if (!(await updateActive({ progress, stage }))) throw new RunCancelled();
  };
}

/**
 * Ends a run whose computation threw: cancelled when the throw was its
 * cancellation; otherwise marked failed with a reason for people (a terrain
 * problem in its own words; anything else is logged and called a server
 * failure) — or cancelled after all when the mark finds the run ended.
 */
export async function endThrownRun(
  kind: 'coverage' | 'siting',
  runId: string,
  error: unknown,
  updateActive: UpdateActive<{ status: 'failed'; stage: string; error: string; finishedAt: Date }>,
): Promise<'failed' | 'cancelled'> {
  if (error instanceof RunCancelled) return 'cancelled';
  const reason =
    error instanceof TerrainInputError
      ? error.message
      : 'The computation failed on the server. Try again; if it fails again, tell your administrator.';
  if (!(error instanceof TerrainInputError)) console.error(`[kenning] ${kind} run ${runId} failed:`, error);
  const marked = await updateActive({ status: 'failed', stage: 'Failed', error: reason, finishedAt: new Date() });
  return marked ? 'failed' : 'cancelled';
}

type RunStateField = 'status' | 'progress' | 'stage' | 'error' | 'requestedBy' | 'createdAt' | 'startedAt' | 'finishedAt';

/** Where a run stands and who asked for it when: the fields every job run answers with the same way. */
export function runStateOf<R extends Record<RunStateField, unknown>>(run: R): Pick<R, RunStateField> {
  const { status, progress, stage, error, requestedBy, createdAt, startedAt, finishedAt } = run;
  return { status, progress, stage, error, requestedBy, createdAt, startedAt, finishedAt };
}
