/* Port: what the coverage use cases need of a job queue (pg-boss in server/queue, inline in tests and the seeder). */

/** What the API needs of the queue. */
export interface CoverageQueue {
  /** Queues a run (`attempt`: the run's attempt number, 1 unless a dead worker's run is queued again); returns the job id. */
  enqueue(runId: string, attempt?: number): Promise<string>;
  /** Withdraws a queued or running job (the worker also notices the run's status). */
  cancel(jobId: string): Promise<void>;
}
