import { checkInput } from '@/shared/sightline/check-input';
import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import type { SphereOptions } from '@/shared/sightline/types';

/** Validated sphere options with the effective radius worked out. */
export interface ResolvedSphere {
  /** Refraction coefficient k. */
  readonly k: number;
  /** Radius of the Earth model R, metres. */
  readonly earthRadiusM: number;
  /**
   * Effective radius R' = R / (1 − k), metres, finite and positive; `null`
   * when k ≥ 1 (flat or concave effective surface: ducting).
   */
  readonly effectiveRadiusM: number | null;
}

/**
 * Applies the defaults to {@link SphereOptions}, validates them, and works
 * out the effective radius once for the other core functions.
 *
 * @param options - `k` (default 0.13) and `earthRadiusM` (default
 *   6 371 008.8 m; any finite positive radius, so the flat-earth limit can be
 *   approached with a very large one)
 * @returns the resolved sphere; `effectiveRadiusM` is `null` for k ≥ 1 and
 *   also if R / (1 − k) overflows (which needs 1 − k below ~1e-300)
 * @throws {SightlineInputError} when k is not finite or the radius is not a
 *   finite positive number
 *
 * Source: the effective-Earth-radius model — IEC 60050-705 (705-05-41) and
 * Federal Standard 1037C, "effective Earth radius": a uniform vertical
 * gradient of refractive index is replaced by straight rays over a sphere of
 * radius R' = R/(1 − k), k = R/ρ with ρ the radius of the ray.
 *
 * @example
 * resolveSphere({ k: 0.25 }).effectiveRadiusM; // 8 494 678.4 (4/3 of R)
 * resolveSphere({ k: 1.2 }).effectiveRadiusM;  // null
 */
export function resolveSphere(options: SphereOptions = {}): ResolvedSphere {
  const k = checkInput('k', options.k ?? STANDARD_OPTICAL_K);
  const earthRadiusM = checkInput('earthRadiusM', options.earthRadiusM ?? MEAN_EARTH_RADIUS_M, {
    min: 0,
    minExclusive: true,
  });
  const curvatureFactor = 1 - k;
  const effective = curvatureFactor > 0 ? earthRadiusM / curvatureFactor : null;
  return {
    k,
    earthRadiusM,
    effectiveRadiusM: effective !== null && Number.isFinite(effective) ? effective : null,
  };
}
