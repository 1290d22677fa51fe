import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Effective Earth radius R' = R / (1 − k): the radius of the sphere over
 * which refracted sightlines can be drawn as straight lines.
 *
 * @param options - `k` (default 0.13) and `earthRadiusM` (default
 *   6 371 008.8 m)
 * @returns R' in metres; `null` with reason `ducting` when k ≥ 1 (R' would
 *   be infinite at k = 1 and negative above it)
 * @throws {SightlineInputError} on a non-finite k or a non-positive radius
 *
 * Source: IEC 60050-705 (705-05-41) "effective radius of the Earth": 4/3 of
 * the actual radius in the standard radio atmosphere, i.e. k = 0.25.
 *
 * @example
 * effectiveRadius({ k: 0.25 }); // { value: 8 494 678.4, reason: null }
 * effectiveRadius({ k: 1 });    // { value: null, reason: 'ducting' }
 */
export function effectiveRadius(options: SphereOptions = {}): Derived {
  const { effectiveRadiusM } = resolveSphere(options);
  return effectiveRadiusM === null ? { value: null, reason: 'ducting' } : { value: effectiveRadiusM, reason: null };
}
