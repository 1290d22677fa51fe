import { SweepInputError } from '@/shared/sightline/sweep-input-error';

/**
 * The definite-range law ("cookie cutter"): every target within R of the
 * track is detected, none beyond. Its sweep width is W = 2R, and on parallel
 * tracks at spacing S the POD is min(1, C) with C = W / S — the optimistic
 * bound of the POD–coverage graphs.
 *
 * @param coverageFactor - C = W / S, ≥ 0
 * @returns POD = min(1, C)
 * @throws {SweepInputError} on a negative or non-finite C
 *
 * Source: B. O. Koopman, Search and Screening (1946/1980), definite-range law
 * — from memory; J. N. Eagle, "Lateral Range Curves and Sweepwidth" (NPS
 * OA3602 notes, 2012) shows its lateral-range curve as a step at ±R.
 *
 * @example
 * definiteRangeParallelSweepPod(0.5); // 0.5
 */
export function definiteRangeParallelSweepPod(coverageFactor: number): number {
  if (!Number.isFinite(coverageFactor) || coverageFactor < 0) {
    throw new SweepInputError('out-of-range', 'coverageFactor', 'The coverage factor must be a number ≥ 0.');
  }
  return Math.min(1, coverageFactor);
}
