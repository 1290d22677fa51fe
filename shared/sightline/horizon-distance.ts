import { checkInput } from '@/shared/sightline/check-input';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Distance to the horizon measured along the surface: the arc from the
 * observer's foot to the tangent point of the (refracted) sightline,
 * d_h = R' · acos(R' / (R' + h)), evaluated as R' · atan2(√(h(2R' + h)), R')
 * to stay accurate for small h.
 *
 * @param heightM - height of eye above the surface, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns arc distance in metres; `null` with reason `ducting` when k ≥ 1
 * @throws {SightlineInputError} on a negative or non-finite height
 *
 * Source: The American Practical Navigator (Bowditch, NGA Pub. 9), Table 12
 * "Distance of the Horizon", D = √(2 r₀ h / β₀) with β₀ = 0.8279 (so
 * k = 1 − β₀), of which this is the exact arc on the effective sphere.
 *
 * @example
 * horizonDistance(2, { k: 0 });    // { value: 5048.2, reason: null } (metres)
 * horizonDistance(2, { k: 1 });    // { value: null, reason: 'ducting' }
 */
export function horizonDistance(heightM: number, options: SphereOptions = {}): Derived {
  checkInput('heightM', heightM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: null, reason: 'ducting' };
  return { value: r * Math.atan2(Math.sqrt(heightM * (2 * r + heightM)), r), reason: null };
}
