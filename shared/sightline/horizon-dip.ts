import { checkInput } from '@/shared/sightline/check-input';
import { resolveSphere } from '@/shared/sightline/resolve-sphere';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * Dip of the horizon: the apparent angle of the visible (sea-level)
 * horizon below the observer's horizontal, positive downward.
 *
 * Under refraction the ray to the horizon is curved; in the effective-radius
 * model it is straight over a sphere of radius R', and the angle it makes
 * with the observer's horizontal — the *apparent* dip, what a sextant or a
 * camera sees — is the geometric dip on that sphere:
 * dip = acos(R' / (R' + h)), evaluated as atan2(√(h(2R' + h)), R') for
 * accuracy at small h. It also equals the central angle from the observer's
 * foot to the tangent point on the effective sphere. (Small-angle check: a
 * ray of curvature k/R leaving at dip δ clears the surface by
 * h − δx + (1 − k)x²/2R, tangent when δ = √(2h(1 − k)/R) = √(2h/R').)
 *
 * @param heightM - height of eye above the surface, metres, ≥ 0
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns the dip in radians; `null` with reason `ducting` when k ≥ 1
 *   (flat or concave effective surface: no geometric horizon)
 * @throws {SightlineInputError} on a negative or non-finite height
 *
 * Source: dip of the sea horizon, The Nautical Almanac (HM Nautical Almanac
 * Office / US Naval Observatory), dip ≈ 1.76′ √h(m) under standard
 * refraction; effective-radius form, IEC 60050-705 (705-05-41).
 *
 * @example
 * horizonDip(10, { k: 0 });    // { value: 0.001772, reason: null } (rad, ≈ 6.09′)
 * horizonDip(10, { k: 1.2 });  // { value: null, reason: 'ducting' }
 */
export function horizonDip(heightM: number, options: SphereOptions = {}): Derived {
  checkInput('heightM', heightM, { min: 0 });
  const { effectiveRadiusM: r } = resolveSphere(options);
  if (r === null) return { value: null, reason: 'ducting' };
  return { value: Math.atan2(Math.sqrt(heightM * (2 * r + heightM)), r), reason: null };
}
