import { VISIBILITY_CONTRAST_THRESHOLD } from '@/shared/sightline/constants';
import { extinctionFromVisibility } from '@/shared/sightline/extinction-from-visibility';
import type { VisibilityKind } from '@/shared/sightline/types';
import { visualRange } from '@/shared/sightline/visual-range';

/**
 * Converts a visibility between the meteorological range (ε = 0.02) and the
 * meteorological optical range (ε = 0.05) through the extinction
 * coefficient they share: V_to = V_from · ln(ε_to) / ln(ε_from). A
 * meteorological range is about 1.31 times the MOR of the same air.
 *
 * @param visibilityM - visibility of kind `from`, metres, > 0
 * @param from - kind of `visibilityM`
 * @param to - kind wanted
 * @returns metres
 * @throws {SightlineInputError} on non-finite or non-positive visibility
 *
 * Source: Koschmieder's law V = −ln(ε)/σ; thresholds as in
 * `extinctionFromVisibility` (AMS Glossary; CIE S 017 / WMO-No. 8).
 *
 * @example
 * convertVisibility(10_000, 'mor-5pct', 'meteorological-range-2pct'); // ≈ 13 058 m
 */
export function convertVisibility(visibilityM: number, from: VisibilityKind, to: VisibilityKind): number {
  const sigma = extinctionFromVisibility(visibilityM, from);
  return from === to ? visibilityM : visualRange(sigma, VISIBILITY_CONTRAST_THRESHOLD[to]);
}
