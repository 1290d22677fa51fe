import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { checkInput } from '@/shared/sightline/check-input';

/**
 * Refraction coefficient from a measured dip of the sea horizon at a known
 * height of eye: the exact inverse of `horizonDip`.
 *
 * On the effective sphere R′ = R/(1 − k) the apparent dip δ satisfies
 * cos δ = R′/(R′ + h), so R′ = h·cos δ/(1 − cos δ) and
 * k = 1 − R/R′ = 1 − R·(1 − cos δ)/(h·cos δ), evaluated with
 * 1 − cos δ = 2 sin²(δ/2) to keep precision at small angles. The small-angle
 * form δ² ≈ 2h(1 − k)/R gives k ≈ 1 − Rδ²/(2h); the exact form is used here.
 *
 * A dip of zero or less (the horizon at or above the observer's horizontal)
 * has no k below 1 in this model: the answer is `null` (ducting, k ≥ 1).
 *
 * @param heightM - height of eye above the sea, metres, > 0
 * @param dipRad - apparent dip of the horizon below the horizontal, radians (positive downward), < π/2
 * @param earthRadiusM - radius of the Earth model, metres (default 6 371 008.8)
 * @returns k, dimensionless; `null` when dip ≤ 0 (k ≥ 1: ducting)
 * @throws {SightlineInputError} on a non-positive height or a non-finite dip
 *
 * Source: dip of the sea horizon in the effective-radius model (The Nautical
 * Almanac's dip ≈ 1.76′ √h(m) is its standard-refraction case; IEC 60050-705,
 * 705-05-41 for R′ = R/(1 − k)); the inversion is algebra on `horizonDip`.
 *
 * @example
 * kFromDip(10, horizonDip(10, { k: 0.16 }).value!); // 0.16
 */
export function kFromDip(heightM: number, dipRad: number, earthRadiusM: number = MEAN_EARTH_RADIUS_M): number | null {
  checkInput('eyeHeightM', heightM, { min: 0, minExclusive: true });
  checkInput('observedDip', dipRad, { max: Math.PI / 2, maxExclusive: true });
  checkInput('earthRadiusM', earthRadiusM, { min: 0, minExclusive: true });
  if (dipRad <= 0) return null;
  const half = Math.sin(dipRad / 2);
  const oneMinusCos = 2 * half * half;
  return 1 - (earthRadiusM * oneMinusCos) / (heightM * Math.cos(dipRad));
}
