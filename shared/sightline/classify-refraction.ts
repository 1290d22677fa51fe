import { checkInput } from '@/shared/sightline/check-input';
import { DUCTING_FROM_K, STANDARD_UP_TO_K, SUB_REFRACTION_BELOW_K } from '@/shared/sightline/constants';
import type { RefractionRegime } from '@/shared/sightline/types';

/**
 * Names the refraction regime of a coefficient k:
 * - `sub-refraction`: k < 0 — rays bend up, away from the surface; the
 *   horizon comes closer and targets sink (air cooling with height faster
 *   than 0.034 K/m, e.g. over sun-heated ground or a warm sea);
 * - `standard`: 0 ≤ k ≤ 0.25 — from straight rays to the radio 4/3 earth,
 *   covering the optical conventions 0.13, 1/7 and the standard-atmosphere
 *   value ≈ 0.17;
 * - `super-refraction`: 0.25 < k < 1 — stronger than standard bending
 *   (temperature inversions): horizons recede, hidden objects loom up;
 * - `ducting`: k ≥ 1 — rays bend at least as fast as the surface; no
 *   geometric horizon, the surface appears to rise toward the distance.
 *
 * The bands are Kenning's choice: the standard band is closed at 0.25 so
 * that the radio standard atmosphere is "standard"; the ducting edge k = 1
 * corresponds to dN/dh ≈ −157 N/km (ITU-R P.834 ducting threshold) and
 * k = 0 to dN/dh = 0.
 *
 * @param k - refraction coefficient, dimensionless
 * @returns the regime
 * @throws {SightlineInputError} on a non-finite k
 *
 * Source: regime names and the ducting criterion dN/dh < −157 N/km as in
 * ITU-R P.834 / P.453 (from memory); band edges as documented above.
 *
 * @example
 * classifyRefraction(0.13); // 'standard'
 * classifyRefraction(1.2);  // 'ducting'
 */
export function classifyRefraction(k: number): RefractionRegime {
  checkInput('k', k);
  if (k < SUB_REFRACTION_BELOW_K) return 'sub-refraction';
  if (k <= STANDARD_UP_TO_K) return 'standard';
  if (k < DUCTING_FROM_K) return 'super-refraction';
  return 'ducting';
}
