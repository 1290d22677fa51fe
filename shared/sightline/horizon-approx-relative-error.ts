import { checkInput } from '@/shared/sightline/check-input';
import { horizonDistance } from '@/shared/sightline/horizon-distance';
import { horizonDistanceApprox } from '@/shared/sightline/horizon-distance-approx';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Relative error of the √(2R'h) horizon approximation against the exact arc
 * distance R' · acos(R'/(R' + h)): (approx − exact) / exact. Positive means
 * the approximation overstates the distance. Roughly 5h / (12R') for
 * h ≪ R' (about 6 × 10⁻⁴ at 8 850 m without refraction): negligible for
 * lookouts, shown so the UI can say so.
 *
 * @param heightM - height of eye above the surface, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns the dimensionless relative error (0 at h = 0); `null` with reason
 *   `ducting` when k ≥ 1
 * @throws {SightlineInputError} on a negative or non-finite height
 *
 * Source: series of acos(1/(1 + ε)) = √(2ε)(1 − 5ε/12 + …) against
 * √(2ε), ε = h/R' (Taylor expansion; elementary).
 *
 * @example
 * horizonApproxRelativeError(8850, { k: 0 }); // { value: 5.8e-4, reason: null }
 */
export function horizonApproxRelativeError(heightM: number, options: SphereOptions = {}): Derived {
  checkInput('heightM', heightM, { min: 0 });
  const exact = horizonDistance(heightM, options);
  const approx = horizonDistanceApprox(heightM, options);
  if (exact.value === null || approx.value === null) return { value: null, reason: 'ducting' };
  if (exact.value === 0) return { value: 0, reason: null };
  return { value: (approx.value - exact.value) / exact.value, reason: null };
}
