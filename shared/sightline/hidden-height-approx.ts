import { checkInput } from '@/shared/sightline/check-input';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * The hand-calculation form of the hidden height: with the horizon at
 * d_h ≈ √(2R'h), hidden ≈ (d − d_h)² / (2R') beyond it and 0 inside. The
 * parabola under-reads the exact secant form by a relative ≈ 5θ²/12,
 * θ = (d − d_h)/R' (about 2 × 10⁻⁵ at 50 km past the horizon); shown beside
 * the exact value so the UI can label it.
 *
 * With k ≥ 1 the result is 0, as for `hiddenHeight`.
 *
 * @param observerHeightM - height of eye, metres, ≥ 0
 * @param distanceM - surface distance to the target, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns metres hidden (always a finite number ≥ 0)
 * @throws {SightlineInputError} on negative or non-finite input
 *
 * Source: combined curvature-and-refraction correction of levelling,
 * c + r = (1 − k) d²/(2R) ≈ 0.0675 d² m with d in km (standard surveying
 * texts).
 *
 * @example
 * hiddenHeightApprox(0, 1000, { k: 1 / 7 }); // { value: 0.0673, reason: null }
 */
export function hiddenHeightApprox(observerHeightM: number, distanceM: number, options: SphereOptions = {}): Derived {
  checkInput('observerHeightM', observerHeightM, { min: 0 });
  checkInput('distanceM', distanceM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: 0, reason: null };
  const beyond = distanceM - Math.sqrt(2 * r * observerHeightM);
  if (beyond <= 0) return { value: 0, reason: null };
  return { value: (beyond * beyond) / (2 * r), reason: null };
}
