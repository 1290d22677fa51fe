import { z } from 'zod';

/**
 * The fields of a queued job run (coverage, siting) that say where it stands
 * and who asked for it when; spread into the run's schema.
 */
export const runStateShape = <const S extends readonly [string, ...string[]]>(statuses: S) => ({
  status: z.enum(statuses),
  /** 0 … 1. */
  progress: z.number(),
  /** What the run is doing, for people. */
  stage: z.string(),
  /** Why it failed, for people; null otherwise. */
  error: z.string().nullable(),
  requestedBy: z.object({ id: z.uuid().nullable(), name: z.string() }),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
