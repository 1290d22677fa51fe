import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';

/**
 * Dip of the sea horizon below the horizontal for an eye `eyeHeightM` above a
 * smooth sea, with the sight line bent by refraction coefficient k: on the
 * sphere of effective radius R' = R/(1 − k) the ray is straight and tangent,
 * so dip = acos(R'/(R' + h)) ≈ √(2h(1 − k)/R).
 *
 * Source: effective-radius model (IEC 60050-705, 705-05-41, as in
 * `shared/sightline/effective-radius.ts`); the same dip as N. Bowditch,
 * "The American Practical Navigator" (NGA Pub. 9), Table 14's formula at the
 * horizon distance.
 *
 * @param eyeHeightM eye above the sea, metres (≥ 0)
 * @param k refraction coefficient (< 1)
 * @param earthRadiusM default the mean radius 6 371 008.8 m
 * @returns radians (≥ 0)
 * @throws {RangeError} on a negative height or k ≥ 1 (a duct has no horizon)
 * @example
 * horizonDipRad(10, 0.13); // ≈ 0.001653 rad (5.7′)
 */
export function horizonDipRad(eyeHeightM: number, k: number, earthRadiusM: number = MEAN_EARTH_RADIUS_M): number {
  const re = effective(k, earthRadiusM);
  if (!(eyeHeightM >= 0)) throw new RangeError('The eye height must be 0 m or more.');
  return Math.acos(re / (re + eyeHeightM));
}

/**
 * Distance over a smooth sea (or level ground at the post's foot) to the
 * point seen `depressionRad` below the horizontal, with the ray bent by k:
 * the near intersection of the straight ray with the sphere of effective
 * radius R' = R/(1 − k), measured along that sphere (the effective-earth
 * picture keeps horizontal distances). With x = R' + h, the slant distance is
 * s = x·sin θ − √(x²·sin²θ − (x² − R'²)) and the ground distance R'·atan2(s·cos θ, x − s·sin θ).
 * For small angles this is Bowditch's "dip short of the horizon" solved for
 * the distance: θ = h/d + d(1 − k)/(2R).
 *
 * Source: N. Bowditch, "The American Practical Navigator" (NGA Pub. 9),
 * Table 14 "Dip of the Sea Short of the Horizon",
 * D = 60·tan⁻¹(h/(6076.1·d) + d/8268) (h feet, d nautical miles, D arc minutes;
 * 8268 = 2·3440.1/0.8321, i.e. k = 0.1679), which this inverts.
 *
 * @param eyeHeightM eye above the sea or the level ground, metres (> 0)
 * @param depressionRad angle below the horizontal, radians (positive down)
 * @param k refraction coefficient (< 1)
 * @param earthRadiusM default the mean radius
 * @returns metres, or null when the ray passes above the horizon (θ ≤ dip: no surface point)
 * @example
 * smoothEarthRangeM(3.048, 11.52 / 60 * Math.PI / 180, 0.1679); // ≈ 926 m (0.5 NM)
 */
export function smoothEarthRangeM(
  eyeHeightM: number,
  depressionRad: number,
  k: number,
  earthRadiusM: number = MEAN_EARTH_RADIUS_M,
): number | null {
  const re = effective(k, earthRadiusM);
  if (!(eyeHeightM > 0)) throw new RangeError('The eye height must be more than 0 m.');
  if (!Number.isFinite(depressionRad)) throw new RangeError('The depression angle must be a finite number.');
  if (depressionRad >= Math.PI / 2) return 0;
  const x = re + eyeHeightM;
  const sin = Math.sin(depressionRad);
  const disc = x * x * sin * sin - (x * x - re * re);
  if (depressionRad <= 0 || disc < 0) return null;
  const s = x * sin - Math.sqrt(disc);
  return re * Math.atan2(s * Math.cos(depressionRad), x - s * sin);
}

function effective(k: number, earthRadiusM: number): number {
  if (!Number.isFinite(k) || k >= 1) {
    throw new RangeError('The refraction coefficient must be below 1 (at k ≥ 1 the ray follows or leaves the earth: no range).');
  }
  if (!(earthRadiusM > 0)) throw new RangeError('The earth radius must be more than 0 m.');
  return earthRadiusM / (1 - k);
}
