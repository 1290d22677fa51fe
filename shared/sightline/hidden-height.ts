import { checkInput } from '@/shared/sightline/check-input';
import { horizonDistance } from '@/shared/sightline/horizon-distance';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Hidden height: how much of a target standing at surface distance `d` from
 * the observer lies below the observer's tangent sightline (the line that
 * grazes the horizon). Zero inside the horizon (d ≤ d_h). Beyond it, on the
 * effective sphere,
 * hidden = R' / cos((d − d_h)/R') − R', evaluated as
 * 2R' sin²(θ/2) / cos θ with θ = (d − d_h)/R' to avoid cancellation.
 *
 * With k ≥ 1 the effective surface is flat or concave: nothing is hidden by
 * curvature and the result is 0 (the caller should flag ducting, where the
 * effective-radius model itself is doubtful).
 *
 * @param observerHeightM - height of eye above the surface, metres, ≥ 0
 * @param distanceM - surface (arc) distance to the target's foot, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres hidden; `null` with reason `beyond-effective-quarter` when
 *   θ ≥ π/2 (the sightline never comes back to that point: the whole target,
 *   of any height, is hidden)
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: the combined curvature-and-refraction correction of levelling,
 * c + r = (1 − k) d²/(2R) ≈ 0.0675 d² m with d in km and k ≈ 1/7 (standard
 * surveying texts), of which this is the exact form on the effective sphere,
 * measured from the tangent point.
 *
 * @example
 * hiddenHeight(0, 8000, { k: 0 });   // { value: 5.02, reason: null }
 * hiddenHeight(10, 5000);           // { value: 0, reason: null } (inside the horizon)
 */
export function hiddenHeight(observerHeightM: number, distanceM: number, options: SphereOptions = {}): Derived {
  checkInput('observerHeightM', observerHeightM, { min: 0 });
  checkInput('distanceM', distanceM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: 0, reason: null };
  const horizon = horizonDistance(observerHeightM, options);
  const beyond = distanceM - (horizon.value ?? 0);
  if (beyond <= 0) return { value: 0, reason: null };
  const theta = beyond / r;
  if (theta >= Math.PI / 2) return { value: null, reason: 'beyond-effective-quarter' };
  const half = Math.sin(theta / 2);
  return { value: (2 * r * half * half) / Math.cos(theta), reason: null };
}
