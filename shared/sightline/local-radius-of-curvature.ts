import { checkInput } from '@/shared/sightline/check-input';
import { WGS84_FLATTENING, WGS84_SEMI_MAJOR_AXIS_M } from '@/shared/physics/constants';

/**
 * Radius of curvature of the WGS 84 ellipsoid along a normal section at a
 * geodetic latitude and azimuth — the sphere that best fits the surface
 * along one line of sight. Pass the result as `earthRadiusM` when a
 * latitude-specific sphere is wanted instead of the mean radius.
 *
 * M = a(1 − e²) / W³ (meridian), N = a / W (prime vertical),
 * W = √(1 − e² sin²φ), and Euler's theorem 1/R_α = cos²α / M + sin²α / N.
 *
 * @param latitudeRad - geodetic latitude φ, radians, in [−π/2, π/2]
 * @param azimuthRad - azimuth α of the sightline from north, radians (any
 *   finite value; only cos² and sin² matter)
 * @returns R_α in metres
 * @throws {SightlineInputError} on non-finite input or |φ| > π/2
 *
 * Source: Euler's theorem on normal curvatures; M and N as in NIMA TR8350.2
 * (2000) and any geodesy text; WGS 84 a and f from NIMA TR8350.2.
 *
 * @example
 * localRadiusOfCurvature(0, 0);           // 6 335 439.3 (meridian at the equator, b²/a)
 * localRadiusOfCurvature(Math.PI / 2, 0); // 6 399 593.6 (at the pole, a²/b)
 */
export function localRadiusOfCurvature(latitudeRad: number, azimuthRad: number): number {
  checkInput('latitudeRad', latitudeRad, { min: -Math.PI / 2, max: Math.PI / 2 });
  checkInput('azimuthRad', azimuthRad);
  const a = WGS84_SEMI_MAJOR_AXIS_M;
  const f = WGS84_FLATTENING;
  const e2 = f * (2 - f);
  const sinPhi = Math.sin(latitudeRad);
  const w = Math.sqrt(1 - e2 * sinPhi * sinPhi);
  const meridian = (a * (1 - e2)) / (w * w * w);
  const primeVertical = a / w;
  const cosA = Math.cos(azimuthRad);
  const sinA = Math.sin(azimuthRad);
  return 1 / ((cosA * cosA) / meridian + (sinA * sinA) / primeVertical);
}
