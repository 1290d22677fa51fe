import { checkInput } from '@/shared/sightline/check-input';
import { VISIBILITY_CONTRAST_THRESHOLD } from '@/shared/sightline/constants';
import type { VisibilityKind } from '@/shared/sightline/types';

/**
 * Extinction coefficient σ of the air from a reported visibility, inverting
 * Koschmieder's law for a black target against the horizon sky,
 * V = −ln(ε) / σ, with the threshold contrast ε of the reported kind:
 * 0.02 for the meteorological range (V = 3.912/σ), 0.05 for the
 * meteorological optical range, MOR (V = 2.996/σ).
 *
 * @param visibilityM - reported visibility, metres, > 0
 * @param kind - `'mor-5pct'` (default; what weather services report) or
 *   `'meteorological-range-2pct'`
 * @returns σ in m⁻¹
 * @throws {SightlineInputError} on non-finite or non-positive visibility
 *
 * Source: AMS Glossary of Meteorology, "meteorological range" (ε = 0.02,
 * V = 3.912/σ) and "visual-range formula"; CIE S 017 (17-31-018) /
 * WMO-No. 8, meteorological optical range (95 % attenuation, ε = 0.05).
 *
 * @example
 * extinctionFromVisibility(10_000);                                // 2.996e-4 m⁻¹
 * extinctionFromVisibility(10_000, 'meteorological-range-2pct');   // 3.912e-4 m⁻¹
 */
export function extinctionFromVisibility(visibilityM: number, kind: VisibilityKind = 'mor-5pct'): number {
  checkInput('visibilityM', visibilityM, { min: 0, minExclusive: true });
  const threshold = VISIBILITY_CONTRAST_THRESHOLD[kind];
  return -Math.log(threshold) / visibilityM;
}
