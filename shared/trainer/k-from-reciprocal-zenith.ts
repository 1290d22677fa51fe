import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { checkInput } from '@/shared/sightline/check-input';

/**
 * Refraction coefficient from reciprocal zenith angles measured at the same
 * time at both ends of a line: k = 1 − R·(z₁ + z₂ − π)/S.
 *
 * Why: the normals at the two ends meet at the Earth's centre at the angle
 * γ = S/R; without refraction z₁ + z₂ = π + γ. Refraction lifts each end's
 * line of sight by r = kγ/2 (a ray of radius R/k over the chord), so
 * z₁ + z₂ = π + γ − 2r = π + (1 − k)S/R. Heights and the instrument heights
 * cancel in the sum, which is why the surveyor's method needs no height.
 *
 * @param distanceM - horizontal (surface) distance between the two stations, metres, > 0
 * @param zenith1Rad - zenith angle observed at station 1 towards station 2, radians, in (0, π)
 * @param zenith2Rad - zenith angle observed at station 2 towards station 1, radians, in (0, π)
 * @param earthRadiusM - radius of the Earth model, metres (default 6 371 008.8)
 * @returns k, dimensionless
 * @throws {SightlineInputError} on a non-positive distance or an angle outside (0, π)
 *
 * Source: reciprocal trigonometric heighting, the coefficient of refraction
 * from simultaneous reciprocal zenith distances, k = 1 − R(z₁ + z₂ − π)/S —
 * G. Bomford, Geodesy (4th ed., 1980), trigonometrical heighting (from
 * memory); the same relation in standard surveying texts on trigonometric
 * levelling.
 *
 * @example
 * // 10 km line, z₁ + z₂ − π = 0.87·S/R (k = 0.13)
 * kFromReciprocalZenith(10_000, Math.PI / 2 + 0.000683, Math.PI / 2 + 0.000683); // ≈ 0.13
 */
export function kFromReciprocalZenith(
  distanceM: number,
  zenith1Rad: number,
  zenith2Rad: number,
  earthRadiusM: number = MEAN_EARTH_RADIUS_M,
): number {
  checkInput('distanceM', distanceM, { min: 0, minExclusive: true });
  checkInput('zenithAngle1', zenith1Rad, { min: 0, max: Math.PI, minExclusive: true, maxExclusive: true });
  checkInput('zenithAngle2', zenith2Rad, { min: 0, max: Math.PI, minExclusive: true, maxExclusive: true });
  checkInput('earthRadiusM', earthRadiusM, { min: 0, minExclusive: true });
  return 1 - (earthRadiusM * (zenith1Rad + zenith2Rad - Math.PI)) / distanceM;
}
