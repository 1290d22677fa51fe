import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';

/** What {@link rayTerrainHit} is given. */
export interface RayTerrainInput {
  /** Ground height along the bearing at a distance from the post, metres (null: off the terrain or nodata). */
  readonly groundAtM: (distanceM: number) => number | null;
  /** Height of the eye above the vertical datum (ground at the post + structure + eye), metres. */
  readonly eyeAltitudeM: number;
  /** Angle of the sight above (+) or below (−) the horizontal, radians. */
  readonly angleRad: number;
  /** Refraction coefficient k of the sight line (< 1). */
  readonly k: number;
  /** Step of the march, metres (half the terrain cell or less). */
  readonly stepM: number;
  /** The farthest distance searched, metres. */
  readonly maxRangeM: number;
  /** Earth radius, metres (default the mean radius). */
  readonly earthRadiusM?: number;
}

/** Where a sight line meets the ground, or why it does not. */
export type RayTerrainHit =
  | { readonly distanceM: number; readonly groundM: number; readonly reason: null }
  | { readonly distanceM: null; readonly groundM: null; readonly reason: 'off-terrain' | 'beyond-range' };

/**
 * The first point where a refracted sight line from a post meets the
 * terrain along its bearing. The ray's height above the datum at ground
 * distance d is z(d) = z_eye + d·tan α − d²(1 − k)/(2R) (the earth falls away
 * by d²/2R, the ray bends down by k·d²/2R, as in the terrain profile); the
 * march steps along d until z falls to the ground, then halves the last step
 * until it is below a millimetre.
 *
 * Source: curvature-and-refraction correction (1 − k)·d²/(2R) (common
 * practice in surveying and in the project's terrain profile); the crossing
 * found by bisection (common practice, no source).
 *
 * @param input the ground along the bearing, the eye, the angle, k, the step and the search range
 * @returns the distance (m) and the ground height there, or why no crossing was found
 * @throws {RangeError} on a step or range that is not positive, or k ≥ 1
 * @example
 * rayTerrainHit({ groundAtM: () => 0, eyeAltitudeM: 100, angleRad: -0.01, k: 0.13, stepM: 10, maxRangeM: 50_000 });
 * // ≈ { distanceM: 9 930, … }
 */
export function rayTerrainHit(input: RayTerrainInput): RayTerrainHit {
  const { groundAtM, eyeAltitudeM, angleRad, k, stepM, maxRangeM } = input;
  const radiusM = input.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  if (!(stepM > 0) || !(maxRangeM > 0)) throw new RangeError('The step and the search range must be more than 0 m.');
  if (!(k < 1)) throw new RangeError('The refraction coefficient must be below 1.');
  const tan = Math.tan(angleRad);
  const drop = (1 - k) / (2 * radiusM);
  const above = (d: number): number | null => {
    const ground = groundAtM(d);
    return ground === null ? null : eyeAltitudeM + d * tan - d * d * drop - ground;
  };
  let near = 0;
  for (let d = stepM; ; d += stepM) {
    const far = Math.min(d, maxRangeM);
    const gap = above(far);
    if (gap === null) return { distanceM: null, groundM: null, reason: 'off-terrain' };
    if (gap <= 0) {
      let lo = near;
      let hi = far;
      while (hi - lo > 1e-3) {
        const mid = (lo + hi) / 2;
        const g = above(mid);
        if (g === null || g <= 0) hi = mid;
        else lo = mid;
      }
      return { distanceM: hi, groundM: groundAtM(hi)!, reason: null };
    }
    if (far >= maxRangeM) return { distanceM: null, groundM: null, reason: 'beyond-range' };
    near = far;
  }
}
