import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';

/**
 * How far the ground at horizontal distance `distance` from an observer lies
 * below the observer's horizontal plane, once the earth's curvature and
 * atmospheric refraction are allowed for:
 *
 *   drop = (1 − k) · d² / (2R)
 *
 * i.e. the curvature drop on a sphere of effective radius R / (1 − k).
 *
 * Source: the combined curvature-and-refraction correction of trigonometric
 * levelling, (1 − k)·d²/(2R) (standard surveying practice; the same model
 * `gdal_viewshed` applies with its curvature coefficient `-cc` = 1 − k, GDAL
 * documentation of gdal_viewshed). Default R: IUGG mean earth radius
 * R1 = 6 371 008.8 m of the Geodetic Reference System 1980 (GRS 80).
 *
 * @param distance horizontal distance, metres (≥ 0)
 * @param refractionCoefficient k, dimensionless; default 0.13
 * @param earthRadius R, metres; default 6 371 008.8
 * @returns the drop, metres
 * @example
 * curvatureDrop(10_000); // ≈ 6.83 m at 10 km with k = 0.13
 */
export function curvatureDrop(
  distance: number,
  refractionCoefficient: number = STANDARD_OPTICAL_K,
  earthRadius: number = MEAN_EARTH_RADIUS_M,
): number {
  return ((1 - refractionCoefficient) * distance * distance) / (2 * earthRadius);
}
