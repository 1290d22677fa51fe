import { checkInput } from '@/shared/sightline/check-input';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Straight length of the sightline from the eye to the tangent point on the
 * effective sphere, √(2R'h + h²) (Pythagoras in the triangle centre–eye–
 * tangent point). Always a little longer than the arc distance.
 *
 * @param heightM - height of eye above the surface, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns the tangent length in metres; `null` with reason `ducting` when
 *   k ≥ 1
 * @throws {SightlineInputError} on a negative or non-finite height
 *
 * Source: elementary geometry of a tangent to a circle, (R' + h)² = R'² + t²,
 * as used for radio line-of-sight range (IEC 60050-705, effective radius).
 *
 * @example
 * tangentLength(100, { k: 0.25 }); // { value: 41 218.3, reason: null }
 */
export function tangentLength(heightM: number, options: SphereOptions = {}): Derived {
  checkInput('heightM', heightM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: null, reason: 'ducting' };
  return { value: Math.sqrt(heightM * (2 * r + heightM)), reason: null };
}
