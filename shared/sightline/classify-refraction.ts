import { checkInput } from '@/shared/sightline/check-input';
import { DUCTING_FROM_K, SUB_REFRACTION_BELOW_K, SUPER_REFRACTION_FROM_K } from '@/shared/sightline/constants';
import type { RefractionRegime } from '@/shared/sightline/types';

/**
 * Names the refraction regime of a coefficient k:
 * - `sub-refraction`: k < 0 — rays bend up, away from the surface; the
 *   horizon comes closer and targets sink (air cooling with height faster
 *   than 0.034 K/m, e.g. over sun-heated ground or a warm sea);
 * - `standard`: 0 ≤ k < 0.5 — from straight rays through the optical
 *   conventions 0.13, 1/7 and the standard-atmosphere value ≈ 0.17 to the
 *   radio 4/3 earth (k = 0.25, dN/dh ≈ −40 N/km);
 * - `super-refraction`: 0.5 ≤ k < 1 (dN/dh between ≈ −79 and −157 N/km) —
 *   much stronger than standard bending (temperature inversions): horizons
 *   recede, hidden objects loom up;
 * - `ducting`: k ≥ 1 — rays bend at least as fast as the surface; no
 *   geometric horizon, the surface appears to rise toward the distance.
 *
 * The edges follow the refractivity-gradient classes of radio meteorology
 * converted with k = −R · dN/dh: dN/dh = 0 → k = 0, −79 N/km → k ≈ 0.5,
 * −157 N/km → k = 1 (ducting). For light, k above about 0.3 is already
 * unusual by day; the UI should show k itself beside the regime.
 *
 * @param k - refraction coefficient, dimensionless
 * @returns the regime
 * @throws {SightlineInputError} on a non-finite k
 *
 * Source: regime classes and thresholds (0, −79, −157 N/km) of radio
 * meteorology as used with ITU-R P.453 / P.834 (stated from memory); the
 * ducting edge is also exact in the model (k = 1 ⇔ R' infinite).
 *
 * @example
 * classifyRefraction(0.13); // 'standard'
 * classifyRefraction(1.2);  // 'ducting'
 */
export function classifyRefraction(k: number): RefractionRegime {
  checkInput('k', k);
  if (k < SUB_REFRACTION_BELOW_K) return 'sub-refraction';
  if (k < SUPER_REFRACTION_FROM_K) return 'standard';
  if (k < DUCTING_FROM_K) return 'super-refraction';
  return 'ducting';
}
