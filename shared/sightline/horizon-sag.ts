import { checkInput } from '@/shared/sightline/check-input';
import { horizonDip } from '@/shared/sightline/horizon-dip';
import type { Derived, SphereOptions } from '@/shared/sightline/types';

/**
 * How far the horizon drops from the centre of a level photograph to its
 * left and right edges. The horizon is a circle at dip δ all round the
 * observer; a level pinhole (rectilinear) camera maps it to the curve
 * y = −tan δ · √(1 + x²) on the image plane (x = tan azimuth), highest in
 * the middle. The sag is the difference of vertical image angles,
 * atan(tan δ / cos(φ/2)) − δ, φ the horizontal field of view.
 *
 * @param heightM - height of eye (camera), metres, ≥ 0
 * @param horizontalFovRad - full horizontal field of view φ, radians, in (0, π)
 * @param options - `k` (default 0.13), `earthRadiusM` (default 6 371 008.8 m)
 * @returns radians, ≥ 0; `null` with reason `ducting` when k ≥ 1
 * @throws {SightlineInputError} on non-finite input, a negative height or a
 *   field of view outside (0, π)
 *
 * Source: central (gnomonic) projection of a cone of directions at
 * depression δ — elementary projective geometry; dip as in `horizonDip`.
 *
 * @example
 * // 2 m eye, 74° lens, no refraction, R = 6 400 km: ≈ 0.0114°
 * horizonSag(2, (74 * Math.PI) / 180, { k: 0, earthRadiusM: 6.4e6 });
 */
export function horizonSag(heightM: number, horizontalFovRad: number, options: SphereOptions = {}): Derived {
  checkInput('horizontalFovRad', horizontalFovRad, { min: 0, max: Math.PI, minExclusive: true, maxExclusive: true });
  const dip = horizonDip(heightM, options);
  if (dip.value === null) return dip;
  const edge = Math.atan(Math.tan(dip.value) / Math.cos(horizontalFovRad / 2));
  return { value: edge - dip.value, reason: null };
}
