import { checkInput } from '@/shared/sightline/check-input';
import { VISIBILITY_CONTRAST_THRESHOLD } from '@/shared/sightline/constants';

/**
 * Daytime visual range of a black target against the horizon sky through
 * air of extinction coefficient σ, for an observer whose threshold contrast
 * is ε: V = −ln(ε) / σ (Koschmieder). ε = 0.05 (default) gives the
 * meteorological optical range, ε = 0.02 the meteorological range.
 *
 * @param extinctionPerM - σ, m⁻¹, > 0
 * @param contrastThreshold - ε, dimensionless, in (0, 1); default 0.05
 * @returns metres
 * @throws {SightlineInputError} on non-finite input, σ ≤ 0, or ε outside (0, 1)
 *
 * Source: AMS Glossary of Meteorology, "visual-range formula" (black-target
 * form); WMO-No. 8 / CIE S 017 meteorological optical range.
 *
 * @example
 * visualRange(3.912e-4, 0.02); // 10 000 m
 */
export function visualRange(
  extinctionPerM: number,
  contrastThreshold: number = VISIBILITY_CONTRAST_THRESHOLD['mor-5pct'],
): number {
  checkInput('extinctionPerM', extinctionPerM, { min: 0, minExclusive: true });
  checkInput('contrastThreshold', contrastThreshold, { min: 0, max: 1, minExclusive: true, maxExclusive: true });
  return -Math.log(contrastThreshold) / extinctionPerM;
}
