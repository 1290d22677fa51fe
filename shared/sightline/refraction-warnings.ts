import type { SightlineWarning } from '@/shared/schemas/sightline';
import { classifyRefraction } from '@/shared/sightline/classify-refraction';
import { formatK } from '@/shared/sightline/format-k';

/** From this k on, the model warns that a duct is near (the horizon runs away as k → 1). */
export const NEAR_DUCT_FROM_K = 0.9;

/**
 * The warnings a refraction coefficient carries by itself, whatever it is
 * used for: ducting (k ≥ 1), sub-refraction (k < 0), super-refraction
 * (0.5 ≤ k < 1: strong inversions) and, from 0.9 on, a duct being near.
 * Standard refraction (0 ≤ k < 0.5) carries none.
 *
 * Used by the sightline evaluation and by field calibrations, so a k of the
 * day that implies a duct or a strong inversion gets the same words as a
 * typed one.
 *
 * @param k - refraction coefficient, dimensionless, finite
 * @returns the warnings, most severe first (empty for standard refraction)
 * @throws {SightlineInputError} on a non-finite k
 *
 * Source: the regime edges of `classifyRefraction` (radio-meteorological
 * classes, stated from memory there); the near-duct growth is exact in the
 * model (R′ = R/(1 − k)).
 *
 * @example
 * refractionWarnings(0.13); // []
 * refractionWarnings(1.2);  // [{ code: 'ducting', … }]
 */
export function refractionWarnings(k: number): SightlineWarning[] {
  const regime = classifyRefraction(k);
  const warnings: SightlineWarning[] = [];
  if (regime === 'ducting') {
    warnings.push({
      code: 'ducting',
      message:
        `k = ${formatK(k)} ≥ 1 (ducting): rays bend at least as fast as the surface, so there is no geometric horizon. ` +
        'Effective radius, horizon distance, tangent length, dip and geographic range do not exist, and nothing is hidden by curvature in this model; ' +
        'real ducts trap light in layers this model does not describe.',
    });
  } else if (regime === 'sub-refraction') {
    warnings.push({
      code: 'sub-refraction',
      message: `k = ${formatK(k)} < 0 (sub-refraction): rays bend upward, horizons come closer and distant targets sink.`,
    });
  } else if (regime === 'super-refraction') {
    warnings.push({
      code: 'super-refraction',
      message: `k = ${formatK(k)} (super-refraction): rays bend more than standard, horizons recede and hidden targets may loom into view.`,
    });
    if (k >= NEAR_DUCT_FROM_K) {
      warnings.push({
        code: 'near-ducting',
        message:
          `k = ${formatK(k)} is close to 1, where the sight line bends as fast as the earth: the horizon and ranges below grow without bound ` +
          `as k nears 1 (the effective radius is ${Math.round(1 / (1 - k))} times the earth's). Such a gradient does not hold over long ranges; ` +
          'read these distances as "very far, unreliable", not as figures.',
      });
    }
  }
  return warnings;
}
