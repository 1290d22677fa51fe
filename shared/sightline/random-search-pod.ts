import { SweepInputError } from '@/shared/sightline/sweep-input-error';

/**
 * Probability of detection of a random search with coverage factor C = W/S
 * (sweep width over track spacing; equivalently W·L/A for track length L in
 * area A): POD = 1 − e^(−C). The pessimistic bound the search literature
 * uses for searches whose tracks are not laid out with care.
 *
 * @param coverageFactor - C, ≥ 0 (dimensionless)
 * @returns POD in [0, 1)
 * @throws {SweepInputError} on a negative or non-finite C
 *
 * Source: B. O. Koopman, Search and Screening (OEG Report 56, 1946; 2nd ed.
 * 1980), the random-search formula — from memory; the same curve is the
 * "random search" line of the POD–coverage graphs in search-planning manuals.
 *
 * @example
 * randomSearchPod(1); // ≈ 0.632
 */
export function randomSearchPod(coverageFactor: number): number {
  if (!Number.isFinite(coverageFactor) || coverageFactor < 0) {
    throw new SweepInputError('out-of-range', 'coverageFactor', 'The coverage factor must be a number ≥ 0.');
  }
  return 1 - Math.exp(-coverageFactor);
}
