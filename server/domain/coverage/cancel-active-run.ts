import type { Transaction } from 'sequelize';
import { ACTIVE_RUN_STATUSES } from '@/shared/schemas/coverage';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { AppError } from '@/server/domain/app-error';
import type { CoverageQueue } from '@/server/domain/ports/coverage-queue';
import type { UseCaseDeps } from '@/server/domain/use-case-deps';
import type { Actor } from '../actor';

/** A queued job run (coverage, siting) as far as cancelling it goes. */
interface CancellableRun {
  id: string;
  status: (typeof ACTIVE_RUN_STATUSES)[number] | 'done' | 'failed' | 'cancelled';
  jobId: string | null;
}

/**
 * Stops a queued or running job run: marks it cancelled only while it is still
 * active (409 `run_ended` otherwise), audits it in the same transaction, then
 * withdraws its job from the queue. The run keeps no result. `runs` is the
 * run's repository (its guarded update), `audit` the entry to record.
 */
export async function cancelActiveRun(
  deps: UseCaseDeps & { queue?: CoverageQueue | null },
  actor: Actor,
  run: CancellableRun,
  runs: {
    updateActive(id: string, patch: { status: 'cancelled'; stage: string; finishedAt: Date }, t: Transaction): Promise<boolean>;
  },
  audit: { action: string; entityType: 'plan' | 'site'; entityId: string },
): Promise<void> {
  if (!(ACTIVE_RUN_STATUSES as readonly string[]).includes(run.status)) {
    throw AppError.conflict(`This run has already ${run.status === 'done' ? 'finished' : run.status}.`, 'run_ended');
  }
  await deps.db.transaction(async (t) => {
    const stopped = await runs.updateActive(run.id, { status: 'cancelled', stage: 'Cancelled', finishedAt: new Date() }, t);
    if (!stopped) throw AppError.conflict('This run ended while you were cancelling it.', 'run_ended');
    await auditRepository.record(actor, { ...audit, after: { runId: run.id } }, t);
  });
  if (run.jobId && deps.queue) await deps.queue.cancel(run.jobId).catch(() => undefined);
}
